// Line/column ↔ offset in the instructions textarea. Lines are split on \n only: the engine numbers lines the
// same way, and a textarea's value always uses \n.

export function offsetOf(text: string, line: number, column: number | null = 0): number {
  let offset = 0;
  const lines = text.split('\n');
  for (let i = 0; i < Math.min(line, lines.length); i++) offset += lines[i].length + 1;
  const here = lines[line] ?? '';
  return Math.min(text.length, offset + Math.min(column ?? 0, here.length));
}

export function positionOf(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, offset);
  const line = before.split('\n').length - 1;
  return { line, column: offset - (before.lastIndexOf('\n') + 1) };
}

/** The offset at the end of the line holding `offset`. */
export function lineEndAt(text: string, offset: number): number {
  const next = text.indexOf('\n', offset);
  return next === -1 ? text.length : next;
}

/** Inserts `line` as a new line after the line the caret is on; returns the new text and where the caret goes. */
export function insertLineAfter(text: string, caret: number, line: string): { text: string; caret: number } {
  if (text.trim() === '') return { text: line, caret: line.length };
  const end = lineEndAt(text, Math.min(caret, text.length));
  const out = `${text.slice(0, end)}\n${line}${text.slice(end)}`;
  return { text: out, caret: end + 1 + line.length };
}
