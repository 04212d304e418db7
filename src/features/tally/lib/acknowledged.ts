// Notes the maker has confirmed ("eyes placed", "changed to pink"), per piece, on this device.
const key = (pieceId: number) => `whorlbook.tally.notes.${pieceId}`;

export function readAcknowledged(pieceId: number): Set<string> {
  try {
    return new Set(JSON.parse(localStorage.getItem(key(pieceId)) ?? '[]') as string[]);
  } catch {
    return new Set();
  }
}

export function writeAcknowledged(pieceId: number, keys: Set<string>) {
  try {
    localStorage.setItem(key(pieceId), JSON.stringify([...keys].slice(-500)));
  } catch {
    /* kept for this visit only */
  }
}
