import type { Knex } from 'knex';
import { checkPiece } from '../../src/engine/index.js';
import type { Terms } from '../../src/engine/types.js';
import { hook } from '../../src/reference/hooks.js';
import { cautionsFor } from '../../src/reference/safety.js';
import type { CreatePatternInput, PatternPieceInput, UpdatePatternInput } from '../../src/schemas/pattern.js';
import type { Gauge, Pattern, PatternListItem, PatternPiece } from '../../src/types/api.js';
import { HttpError, notFound } from '../lib/http-error.js';
import { parseJson, readMaterials } from '../lib/json-columns.js';

// Patterns and their pieces. The stitch engine checks every piece on every save and read, so a pattern
// always comes back with the counts of the text as it is stored now (the engine may improve between reads).

interface PatternRow {
  id: number;
  owner_id: string;
  title: string;
  designer_credit: string | null;
  source_url: string | null;
  terms: Terms;
  gauge: string | null;
  skill_notes: string | null;
  materials: string;
  visibility: Pattern['visibility'];
  created_at: string;
  updated_at: string;
}

interface PieceRow {
  id: number;
  pattern_id: number;
  position: number;
  name: string;
  copies: number;
  hook_mm: number | null;
  yarns: string;
  instructions: string;
}

const blankToNull = (s: string | null | undefined) => (s == null || s.trim() === '' ? null : s.trim());



export function checkText(instructions: string, terms: Terms): PatternPiece['check'] {
  const result = checkPiece(instructions, { terms });
  const rounds = result.rounds.map((r) => ({
    number: r.number,
    label: r.label,
    line: r.line,
    stitches: r.stitches,
    worked: r.worked,
    stated: r.stated,
    problems: r.problems.map((p) => ({ message: p.message, column: p.column, severity: p.severity })),
  }));
  return { rounds, problemCount: rounds.reduce((n, r) => n + r.problems.length, 0) };
}

function toPiece(row: PieceRow, terms: Terms): PatternPiece {
  return {
    id: row.id,
    position: row.position,
    name: row.name,
    copies: row.copies,
    hookMm: row.hook_mm,
    hook: row.hook_mm == null ? null : hook(row.hook_mm),
    yarns: parseJson<string[]>(row.yarns, []),
    instructions: row.instructions,
    check: checkText(row.instructions, terms),
  };
}

function toPattern(row: PatternRow, pieces: PieceRow[], viewerId: string): Pattern {
  const materials = readMaterials(row.materials);
  return {
    id: row.id,
    title: row.title,
    designerCredit: row.designer_credit,
    sourceUrl: row.source_url,
    terms: row.terms,
    gauge: parseJson<Gauge | null>(row.gauge, null),
    skillNotes: row.skill_notes,
    materials,
    visibility: row.visibility,
    mine: row.owner_id === viewerId,
    pieces: pieces.map((p) => toPiece(p, row.terms)),
    cautions: cautionsFor({ notions: materials.notions }),
    createdAt: row.created_at,
    updatedAt: row.updated_at,
  };
}

function pieceColumns(p: PatternPieceInput, position: number) {
  return {
    position,
    name: p.name,
    copies: p.copies,
    hook_mm: p.hookMm ?? null,
    yarns: JSON.stringify(p.yarns ?? []),
    instructions: p.instructions,
  };
}

async function loadPieces(db: Knex, patternId: number): Promise<PieceRow[]> {
  return db('pattern_pieces')
    .where({ pattern_id: patternId })
    .orderBy([{ column: 'position' }, { column: 'id' }]);
}

/** A pattern the member may read: their own, or anyone's public one. Everything else is a 404. */
async function readablePattern(db: Knex, userId: string, patternId: number): Promise<PatternRow> {
  const row = await db('patterns')
    .where({ id: patternId })
    .andWhere((q) => q.where({ owner_id: userId }).orWhere({ visibility: 'public' }))
    .first();
  if (!row) throw notFound('That pattern');
  return row;
}

/** The member's own pattern, for changes. A public pattern of someone else's is readable but not theirs to change. */
async function writablePattern(db: Knex, userId: string, patternId: number): Promise<PatternRow> {
  const row = await readablePattern(db, userId, patternId);
  if (row.owner_id !== userId)
    throw new HttpError(
      403,
      'Only the member who wrote this pattern can change it. Start a project from it to keep your own copy.',
    );
  return row;
}

export async function getPattern(db: Knex, userId: string, patternId: number): Promise<Pattern> {
  const row = await readablePattern(db, userId, patternId);
  return toPattern(row, await loadPieces(db, row.id), userId);
}

export async function createPattern(db: Knex, userId: string, input: CreatePatternInput): Promise<Pattern> {
  const id = await db.transaction(async (trx) => {
    const [{ id: patternId }] = await trx('patterns')
      .insert({
        owner_id: userId,
        title: input.title,
        designer_credit: blankToNull(input.designerCredit),
        source_url: blankToNull(input.sourceUrl),
        terms: input.terms,
        gauge: input.gauge ? JSON.stringify(input.gauge) : null,
        skill_notes: blankToNull(input.skillNotes),
        materials: JSON.stringify(input.materials ?? { yarns: [], hooks: [], notions: [] }),
        visibility: input.visibility ?? 'private',
      })
      .returning('id');
    await trx('pattern_pieces').insert(
      input.pieces.map((p, i) => ({ pattern_id: patternId, ...pieceColumns(p, i) })),
    );
    return patternId as number;
  });
  return getPattern(db, userId, id);
}

export async function updatePattern(
  db: Knex,
  userId: string,
  patternId: number,
  input: UpdatePatternInput,
): Promise<Pattern> {
  await db.transaction(async (trx) => {
    await writablePattern(trx, userId, patternId);
    const changes: Record<string, unknown> = {};
    if (input.title !== undefined) changes.title = input.title;
    if (input.terms !== undefined) changes.terms = input.terms;
    if (input.designerCredit !== undefined) changes.designer_credit = blankToNull(input.designerCredit);
    if (input.sourceUrl !== undefined) changes.source_url = blankToNull(input.sourceUrl);
    if (input.gauge !== undefined) changes.gauge = input.gauge ? JSON.stringify(input.gauge) : null;
    if (input.skillNotes !== undefined) changes.skill_notes = blankToNull(input.skillNotes);
    if (input.materials !== undefined) changes.materials = JSON.stringify(input.materials);
    if (input.visibility !== undefined) changes.visibility = input.visibility;
    changes.updated_at = trx.raw("strftime('%Y-%m-%dT%H:%M:%fZ','now')");
    await trx('patterns').where({ id: patternId }).update(changes);

    if (input.pieces !== undefined) {
      // Replace the list, keeping the ids of pieces the editor sent back (ids from another pattern are ignored).
      const existing = new Set(
        (await trx('pattern_pieces').where({ pattern_id: patternId }).select('id')).map(
          (r: { id: number }) => r.id,
        ),
      );
      const kept = new Set<number>();
      for (const [i, p] of input.pieces.entries()) {
        if (p.id !== undefined && existing.has(p.id) && !kept.has(p.id)) {
          kept.add(p.id);
          await trx('pattern_pieces').where({ id: p.id }).update(pieceColumns(p, i));
        } else {
          await trx('pattern_pieces').insert({ pattern_id: patternId, ...pieceColumns(p, i) });
        }
      }
      const gone = [...existing].filter((id) => !kept.has(id));
      if (gone.length) await trx('pattern_pieces').whereIn('id', gone).delete();
    }
  });
  return getPattern(db, userId, patternId);
}

/** Projects started from the pattern keep their own copy; their pattern_id goes to null (foreign key SET NULL). */
export async function deletePattern(db: Knex, userId: string, patternId: number): Promise<void> {
  await db.transaction(async (trx) => {
    await writablePattern(trx, userId, patternId);
    await trx('patterns').where({ id: patternId }).delete();
  });
}

export async function listPatterns(db: Knex, userId: string): Promise<PatternListItem[]> {
  const rows: PatternRow[] = await db('patterns')
    .where({ owner_id: userId })
    .orderBy([
      { column: 'updated_at', order: 'desc' },
      { column: 'id', order: 'desc' },
    ]);
  if (!rows.length) return [];
  const pieces: PieceRow[] = await db('pattern_pieces')
    .whereIn(
      'pattern_id',
      rows.map((r) => r.id),
    )
    .select('id', 'pattern_id', 'instructions');
  const byPattern = new Map<number, PieceRow[]>();
  for (const p of pieces) byPattern.set(p.pattern_id, [...(byPattern.get(p.pattern_id) ?? []), p]);
  return rows.map((r) => {
    const own = byPattern.get(r.id) ?? [];
    return {
      id: r.id,
      title: r.title,
      designerCredit: r.designer_credit,
      pieceCount: own.length,
      problemCount: own.reduce((n, p) => n + checkText(p.instructions, r.terms).problemCount, 0),
      updatedAt: r.updated_at,
      visibility: r.visibility,
    };
  });
}
