import { checkPiece } from '@/engine';
import { hook } from '@/reference/hooks';
import { cautionsFor } from '@/reference/safety';
import type { Pattern, Project, ProjectPiece } from '@/types/api';

// Answers shaped like the server's, built with the same engine and reference tables the server uses.

export const ballText = ['Rnd 1: 6 sc in MR (6)', 'Rnd 2: inc x6 (12)', 'Rnd 3: (sc, inc) x6 (18)'].join('\n');
export const earText = ['Rnd 1: 4 sc in MR (4)', 'Rnd 2: inc x4 (8)', 'Place a pin between Rnds 1 and 2.'].join('\n');

export function buildPiece(overrides: Partial<ProjectPiece> & { id: number; name: string }): ProjectPiece {
  const instructions = overrides.instructions ?? ballText;
  const check = checkPiece(instructions, { terms: 'us' });
  const hookMm = overrides.hookMm === undefined ? 3.5 : overrides.hookMm;
  return {
    position: 0,
    copies: 1,
    hookMm,
    hook: hookMm != null ? hook(hookMm) : null,
    yarns: [],
    instructions,
    progress: { copy: 1, round: 0, step: 0, done: 0, version: 0, updatedAt: null },
    totals: { rounds: check.rounds.length, stepsPerCopy: check.totalSteps, copiesDone: 0, roundsDone: 0 },
    placements: [],
    ...overrides,
  };
}

export function buildProject(overrides: Partial<Project> = {}): Project {
  const materials = overrides.materials ?? {
    yarns: [{ name: 'Moss cotton', colour: 'moss green', fibre: 'cotton', weight: 3, metersUsed: 40 }],
    hooks: [{ mm: 3.5 }],
    notions: [{ kind: 'safety_eyes' as const, sizeMm: 6, quantity: 2 }],
  };
  const forYoungChild = overrides.forYoungChild ?? false;
  return {
    id: 5,
    title: 'Owl for Ada',
    status: 'on_the_hook',
    patternId: 3,
    patternCredit: { title: 'Moss the pocket owl', designerCredit: 'Test studio', sourceUrl: null },
    terms: 'us',
    startedOn: '2026-11-20',
    finishedOn: null,
    recipient: 'Ada',
    forYoungChild,
    materials,
    notes: 'Eyes a little wider apart than the pattern.',
    visibility: 'private',
    shareUrl: null,
    coverPhoto: null,
    pieces: [],
    cautions: cautionsFor({ forYoungChild, notions: materials.notions }),
    createdAt: '2026-11-20T10:00:00.000Z',
    updatedAt: '2026-11-21T10:00:00.000Z',
    ...overrides,
  };
}

export function buildPattern(overrides: Partial<Pattern> = {}): Pattern {
  const pieces = [
    { name: 'Head', copies: 1, hookMm: 3.5, instructions: ballText },
    { name: 'Ear', copies: 2, hookMm: 2.75, instructions: earText },
  ].map((p, i) => {
    const check = checkPiece(p.instructions, { terms: 'us' });
    return {
      id: 30 + i,
      position: i,
      ...p,
      hook: hook(p.hookMm),
      yarns: [],
      check: {
        rounds: check.rounds.map((r) => ({ number: r.number, label: r.label, line: r.line, stitches: r.stitches, worked: r.worked, stated: r.stated, problems: r.problems })),
        problemCount: 0,
      },
    };
  });
  const materials = { yarns: [], hooks: [{ mm: 3.5 }], notions: [{ kind: 'safety_eyes' as const, sizeMm: 6, quantity: 2 }] };
  return {
    id: 3,
    title: 'Moss the pocket owl',
    designerCredit: 'Test studio',
    sourceUrl: null,
    terms: 'us',
    gauge: null,
    skillNotes: null,
    materials,
    visibility: 'private',
    mine: true,
    pieces,
    cautions: cautionsFor({ notions: materials.notions }),
    createdAt: '2026-11-01T10:00:00.000Z',
    updatedAt: '2026-11-01T10:00:00.000Z',
    ...overrides,
  };
}
