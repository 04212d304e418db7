import type { Knex } from 'knex';

// Patterns are written straight into the database here: the projects tests need a pattern to start from,
// not the patterns API (which has its own tests).

export const twoRoundBall = ['Rnd 1: 6 sc in MR (6)', 'Rnd 2: inc x6 (12)', 'Rnd 3: (sc, inc) x6 (18)'].join('\n');

export function buildPatternPieces() {
  return [
    { name: 'Head', copies: 1, hookMm: 3.5, yarns: ['Moss cotton'], instructions: twoRoundBall },
    { name: 'Ear', copies: 2, hookMm: 2.75, yarns: ['Moss cotton'], instructions: ['Rnd 1: 4 sc in MR (4)', 'Rnd 2: inc x4 (8)'].join('\n') },
  ];
}

export async function createPattern(
  db: Knex,
  ownerId: string,
  overrides: Partial<{ title: string; visibility: 'private' | 'testers' | 'public'; terms: 'us' | 'uk'; designerCredit: string | null; sourceUrl: string | null; materials: unknown; pieces: ReturnType<typeof buildPatternPieces> }> = {},
) {
  const o = {
    title: 'Moss the pocket owl',
    visibility: 'private' as const,
    terms: 'us' as const,
    designerCredit: 'Test studio',
    sourceUrl: 'https://example.com/moss-owl',
    materials: {
      yarns: [{ name: 'Moss cotton', colour: 'moss green', fibre: 'cotton', weight: 3, metersPerSkein: 100 }],
      hooks: [{ mm: 3.5 }],
      notions: [{ kind: 'safety_eyes', sizeMm: 6, quantity: 2 }, { kind: 'stuffing' }],
    },
    pieces: buildPatternPieces(),
    ...overrides,
  };
  const [{ id }] = await db('patterns')
    .insert({
      owner_id: ownerId,
      title: o.title,
      designer_credit: o.designerCredit,
      source_url: o.sourceUrl,
      terms: o.terms,
      visibility: o.visibility,
      materials: JSON.stringify(o.materials),
    })
    .returning('id');
  await db('pattern_pieces').insert(
    o.pieces.map((p, position) => ({
      pattern_id: id,
      position,
      name: p.name,
      copies: p.copies,
      hook_mm: p.hookMm,
      yarns: JSON.stringify(p.yarns),
      instructions: p.instructions,
    })),
  );
  return id as number;
}

export function buildProjectInput(overrides: Record<string, unknown> = {}) {
  return {
    title: 'A ball for the cat',
    pieces: [{ name: 'Ball', instructions: twoRoundBall, copies: 1, hookMm: 3.5 }],
    ...overrides,
  };
}
