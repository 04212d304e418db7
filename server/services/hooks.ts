import type { Knex } from 'knex';
import type { z } from 'zod';
import type { HookInputSchema, UpdateHookSchema } from '../../src/schemas/hooks.js';
import type { RollHook } from '../../src/types/hooks.js';
import { usHookSize } from '../../src/reference/hooks.js';
import { notFound } from '../lib/http-error.js';

type Row = Record<string, any>;
type CreateInput = z.output<typeof HookInputSchema>;
type UpdateInput = z.output<typeof UpdateHookSchema>;

function toRollHook(row: Row): RollHook {
  return {
    id: row.id,
    mm: row.size_mm,
    us: usHookSize(row.size_mm),
    material: row.material ?? null,
    brand: row.brand ?? null,
    note: row.note ?? null,
    quantity: row.quantity,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
  };
}

async function ownedHook(db: Knex, ownerId: string, id: number) {
  const row = await db('hooks').where({ id, owner_id: ownerId }).first();
  if (!row) throw notFound('That hook');
  return row;
}

const columns = (input: UpdateInput) => {
  const out: Row = {};
  const map: Record<string, string> = { mm: 'size_mm', material: 'material', brand: 'brand', note: 'note', quantity: 'quantity' };
  for (const [key, column] of Object.entries(map)) {
    const v = (input as Row)[key];
    if (v !== undefined) out[column] = v === '' ? null : v;
  }
  return out;
};

/** Smallest hook first, the order a roll is kept in. */
export async function listHooks(db: Knex, ownerId: string) {
  const rows = await db('hooks').where({ owner_id: ownerId }).orderBy([{ column: 'size_mm' }, { column: 'id' }]);
  return rows.map(toRollHook);
}

export async function getHook(db: Knex, ownerId: string, id: number) {
  return toRollHook(await ownedHook(db, ownerId, id));
}

export async function createHook(db: Knex, ownerId: string, input: CreateInput) {
  const [{ id }] = await db('hooks')
    .insert({ owner_id: ownerId, ...columns(input) })
    .returning('id');
  return getHook(db, ownerId, id as number);
}

export async function updateHook(db: Knex, ownerId: string, id: number, input: UpdateInput) {
  return db.transaction(async (trx) => {
    await ownedHook(trx, ownerId, id);
    await trx('hooks').where({ id, owner_id: ownerId }).update({ ...columns(input), updated_at: new Date().toISOString() });
    return getHook(trx, ownerId, id);
  });
}

export async function deleteHook(db: Knex, ownerId: string, id: number) {
  await db.transaction(async (trx) => {
    await ownedHook(trx, ownerId, id);
    await trx('hooks').where({ id, owner_id: ownerId }).delete();
  });
}
