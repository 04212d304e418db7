import type { Knex } from 'knex';
import type { z } from 'zod';
import { MaterialsSchema } from '../../src/schemas/materials.js';
import type { ShelfYarnInputSchema, UpdateShelfYarnSchema } from '../../src/schemas/yarn.js';
import type { ShelfYarn } from '../../src/types/api.js';
import { notFound } from '../lib/http-error.js';

type Row = Record<string, any>;
type CreateInput = z.output<typeof ShelfYarnInputSchema>;
type UpdateInput = z.output<typeof UpdateShelfYarnSchema>;

// 1 yd = 0.9144 m exactly (international yard, 1959).
const M_PER_YD = 0.9144;
const round1 = (n: number) => Math.round(n * 10) / 10;

function metersPerSkein(row: Row): number | null {
  if (row.meters_per_skein) return row.meters_per_skein;
  if (row.yards_per_skein) return row.yards_per_skein * M_PER_YD;
  return null;
}

/**
 * Meters each shelf yarn has gone into, summed over the owner's projects that name it (materials.yarns[].shelfYarnId).
 * A frogged project gives its yarn back, so it is not counted. A project yarn that gives skeins but no meters is
 * counted at the shelf yarn's length per skein.
 */
async function metersUsedByShelfYarn(db: Knex, ownerId: string, shelf: Row[]) {
  const perSkein = new Map(shelf.map((y) => [y.id, metersPerSkein(y)]));
  const used = new Map<number, number>();
  const projects: Row[] = await db('projects').where({ owner_id: ownerId }).whereNot({ status: 'frogged' }).select('materials');
  for (const p of projects) {
    let materials;
    try {
      materials = MaterialsSchema.safeParse(JSON.parse(p.materials || '{}'));
    } catch {
      continue;
    }
    if (!materials.success) continue;
    for (const y of materials.data.yarns) {
      if (y.shelfYarnId == null || !perSkein.has(y.shelfYarnId)) continue;
      const per = perSkein.get(y.shelfYarnId) ?? null;
      const meters = y.metersUsed ?? (y.skeinsUsed != null && per != null ? y.skeinsUsed * per : 0);
      used.set(y.shelfYarnId, (used.get(y.shelfYarnId) ?? 0) + meters);
    }
  }
  return used;
}

function toShelfYarn(row: Row, usedMeters: number): ShelfYarn {
  const per = metersPerSkein(row);
  // Never below zero: using more than the shelf says means the shelf count is out of date, not negative yarn.
  const left = per != null ? Math.max(0, row.skeins_owned * per - usedMeters) : null;
  return {
    id: row.id,
    name: row.name,
    colour: row.colour ?? undefined,
    fibre: row.fibre ?? undefined,
    weight: row.weight ?? undefined,
    ply: row.ply ?? undefined,
    metersPerSkein: row.meters_per_skein ?? undefined,
    yardsPerSkein: row.yards_per_skein ?? undefined,
    skeinsOwned: row.skeins_owned,
    metersUsed: round1(usedMeters),
    metersLeft: left != null ? round1(left) : null,
    yardsLeft: left != null ? round1(left / M_PER_YD) : null,
    notes: row.notes ?? null,
  };
}

async function serialize(db: Knex, ownerId: string, rows: Row[]) {
  const used = await metersUsedByShelfYarn(db, ownerId, rows);
  return rows.map((r) => toShelfYarn(r, used.get(r.id) ?? 0));
}

async function ownedYarn(db: Knex, ownerId: string, id: number) {
  const row = await db('yarns').where({ id, owner_id: ownerId }).first();
  if (!row) throw notFound('That yarn');
  return row;
}

export async function listYarns(db: Knex, ownerId: string) {
  const rows = await db('yarns').where({ owner_id: ownerId }).orderBy([{ column: 'name' }, { column: 'id' }]);
  return serialize(db, ownerId, rows);
}

export async function getYarn(db: Knex, ownerId: string, id: number) {
  const [yarn] = await serialize(db, ownerId, [await ownedYarn(db, ownerId, id)]);
  return yarn;
}

const columns = (input: UpdateInput) => {
  const out: Row = {};
  const map: Record<string, string> = {
    name: 'name',
    colour: 'colour',
    fibre: 'fibre',
    weight: 'weight',
    ply: 'ply',
    metersPerSkein: 'meters_per_skein',
    yardsPerSkein: 'yards_per_skein',
    skeinsOwned: 'skeins_owned',
    notes: 'notes',
  };
  for (const [key, column] of Object.entries(map)) {
    const v = (input as Row)[key];
    if (v !== undefined) out[column] = v === '' ? null : v;
  }
  return out;
};

export async function createYarn(db: Knex, ownerId: string, input: CreateInput) {
  const id = await db.transaction(async (trx) => {
    const [{ id }] = await trx('yarns')
      .insert({ owner_id: ownerId, ...columns(input) })
      .returning('id');
    return id as number;
  });
  return getYarn(db, ownerId, id);
}

export async function updateYarn(db: Knex, ownerId: string, id: number, input: UpdateInput) {
  await db.transaction(async (trx) => {
    await ownedYarn(trx, ownerId, id);
    await trx('yarns').where({ id, owner_id: ownerId }).update({ ...columns(input), updated_at: new Date().toISOString() });
  });
  return getYarn(db, ownerId, id);
}

/** Projects keep their own copy of the yarn's details; only the link back to the shelf goes stale. */
export async function deleteYarn(db: Knex, ownerId: string, id: number) {
  await db.transaction(async (trx) => {
    await ownedYarn(trx, ownerId, id);
    await trx('yarns').where({ id, owner_id: ownerId }).delete();
  });
}
