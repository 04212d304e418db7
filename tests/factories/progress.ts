import type { Knex } from 'knex';

// Projects and pieces written straight into the database: the Tally's tests need a piece to count on, not the
// projects API (which has its own tests).

/** A small ball top: three rounds whose counts are right (common practice: 6 sc in a magic ring, +6 a round). */
export const ballTop = ['Rnd 1: 6 sc in MR (6)', 'Rnd 2: inc x6 (12)', 'Rnd 3: (sc, inc) x6 (18)'].join('\n');

/** Two rounds with a note before the second, for the note-before-a-round cases. */
export const earWithNote = ['Rnd 1: 4 sc in MR (4)', 'Change to pink yarn.', 'Rnd 2: inc x4 (8)'].join('\n');

export interface TestPiece {
  name: string;
  instructions: string;
  copies?: number;
}

/** A project of the owner's with the given pieces; returns the project id and the piece ids in order. */
export async function createTallyProject(db: Knex, ownerId: string, pieces: TestPiece[] = [{ name: 'Ball', instructions: ballTop }], terms: 'us' | 'uk' = 'us') {
  const [{ id: projectId }] = await db('projects').insert({ owner_id: ownerId, title: 'A ball to count', status: 'on_the_hook', terms }).returning('id');
  const rows = await db('project_pieces')
    .insert(pieces.map((p, position) => ({ project_id: projectId, position, name: p.name, copies: p.copies ?? 1, instructions: p.instructions })))
    .returning('id');
  return { projectId: projectId as number, pieceIds: rows.map((r: { id: number }) => r.id) };
}

/** A fresh opId, made the way the browser makes one. */
export const newOpId = () => crypto.randomUUID();
