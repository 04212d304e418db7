import type { Knex } from 'knex';
import type { Logger } from '../lib/logger.js';
import { createUser } from './users.js';
import { demoPattern } from './demo-pattern.js';
import { seedProgress } from './progress.js';

export const DEMO_MAKER = { email: 'demo-maker@example.com', password: 'loops-and-rounds', displayName: 'Wren (demo maker)' };
export const DEMO_ADMIN = { email: 'admin@example.com', password: 'admin-loops-and-rounds', displayName: 'Whorlbook admin' };

/** True once the demo has been seeded into this database (the sign-in page then shows the demo accounts). */
export async function hasDemo(db: Knex) {
  return Boolean(await db('users').where({ email: DEMO_MAKER.email }).first('id'));
}

/** Seeds the demo on first start with an empty database; does nothing otherwise. */
export async function seedDemo(db: Knex, logger?: Logger) {
  const { count } = (await db('users').count({ count: '*' }).first()) as { count: number };
  if (Number(count) > 0) return false;

  const maker = await createUser(db, { ...DEMO_MAKER, emailVerified: true });
  await createUser(db, { ...DEMO_ADMIN, role: 'admin', emailVerified: true });

  await db.transaction(async (trx) => {
    const p = demoPattern;
    const [{ id: patternId }] = await trx('patterns')
      .insert({
        owner_id: maker.id,
        title: p.title,
        designer_credit: p.designerCredit,
        source_url: p.sourceUrl,
        terms: p.terms,
        gauge: JSON.stringify(p.gauge),
        skill_notes: p.skillNotes,
        materials: JSON.stringify(p.materials),
      })
      .returning('id');
    await trx('pattern_pieces').insert(
      p.pieces.map((piece, position) => ({
        pattern_id: patternId,
        position,
        name: piece.name,
        copies: piece.copies,
        hook_mm: piece.hookMm,
        yarns: JSON.stringify(piece.yarns),
        instructions: piece.instructions,
      })),
    );

    // The yarn shelf: what the demo maker owns; the project draws its plum and green from it.
    const shelf = [
      { name: 'Plum cotton', colour: 'plum', fibre: 'cotton', weight: 3, ply: '8 ply', meters_per_skein: 125, yards_per_skein: 137, skeins_owned: 2, notes: 'Soft, good stitch definition.' },
      { name: 'Leaf cotton', colour: 'leaf green', fibre: 'cotton', weight: 3, ply: '8 ply', meters_per_skein: 125, yards_per_skein: 137, skeins_owned: 1, notes: null },
      { name: 'Bark cotton', colour: 'brown', fibre: 'cotton', weight: 3, ply: '8 ply', meters_per_skein: 125, yards_per_skein: 137, skeins_owned: 0.5, notes: 'Leftover from the acorn set.' },
      { name: 'Oat wool blend', colour: 'oatmeal', fibre: 'wool/acrylic', weight: 4, ply: '10 ply', meters_per_skein: 190, yards_per_skein: 208, skeins_owned: 3, notes: null },
    ];
    const shelfIds: number[] = [];
    for (const y of shelf) {
      const [{ id }] = await trx('yarns').insert({ owner_id: maker.id, ...y }).returning('id');
      shelfIds.push(id);
    }
    // The hook roll has the 3.5 mm the body and leaves need, but not the stalk's 2.5 mm, so the project page shows both.
    await trx('hooks').insert([
      { owner_id: maker.id, size_mm: 3.5, material: 'aluminium', brand: null, note: 'The everyday one.', quantity: 1 },
      { owner_id: maker.id, size_mm: 4, material: 'bamboo', brand: null, note: null, quantity: 1 },
      { owner_id: maker.id, size_mm: 5, material: 'ergonomic', brand: null, note: 'For the chunky blanket.', quantity: 1 },
    ]);
    const used = [40, 12, 3]; // meters so far, per pattern yarn
    const projectMaterials = {
      ...p.materials,
      yarns: p.materials.yarns.map((y, i) => ({ ...y, shelfYarnId: shelfIds[i], metersUsed: used[i] })),
    };

    const [{ id: projectId }] = await trx('projects')
      .insert({
        owner_id: maker.id,
        pattern_id: patternId,
        title: 'Bramble for the window sill',
        status: 'on_the_hook',
        terms: p.terms,
        pattern_credit: JSON.stringify({ title: p.title, designerCredit: p.designerCredit, sourceUrl: p.sourceUrl }),
        started_on: '2026-11-24',
        recipient: 'my sister Ines',
        for_young_child: false,
        materials: JSON.stringify(projectMaterials),
        notes: 'Using the plum cotton from the yarn shelf. Eyes: 8 mm safety eyes.',
      })
      .returning('id');
    const pieceRows = await trx('project_pieces')
      .insert(
        p.pieces.map((piece, position) => ({
          project_id: projectId,
          position,
          name: piece.name,
          copies: piece.copies,
          hook_mm: piece.hookMm,
          yarns: JSON.stringify(piece.yarns),
          instructions: piece.instructions,
        })),
      )
      .returning('id');
    const bodyId = pieceRows[0].id;

    // The Tally mid-piece: the Body at Rnd 10 (round index 9), with the eye spots already marked on Rnd 9.
    await seedProgress(trx, bodyId, p.pieces[0].instructions, p.pieces[0].copies, p.terms, { copy: 1, round: 9, step: 9 });
    await trx('placements').insert([
      { piece_id: bodyId, copy: 1, round: 9, step: 15, label: 'left eye', note: 'Locking marker where the 8 mm safety eye goes in after Rnd 12.' },
      { piece_id: bodyId, copy: 1, round: 9, step: 21, label: 'right eye', note: '6 sts from the left eye.' },
    ]);

    await trx('journal_entries').insert([
      {
        project_id: projectId,
        piece_id: null,
        author_id: maker.id,
        body: 'Wound the plum cotton and found my 3.5 mm hook. Starting tonight.',
        entry_date: '2026-11-24',
        minutes: 10,
        tags: JSON.stringify(['progress']),
      },
      {
        project_id: projectId,
        piece_id: bodyId,
        author_id: maker.id,
        body: 'Body up to **Rnd 6** (36 sts). Moved the increases each round so the ball stays round, not hexagonal.',
        entry_date: '2026-11-25',
        minutes: 35,
        tags: JSON.stringify(['progress']),
      },
      {
        project_id: projectId,
        piece_id: bodyId,
        author_id: maker.id,
        body: 'Working the even rounds a little tighter than the pattern gauge — went down to a 3.25 mm hook for Rnds 7–12.',
        entry_date: '2026-11-27',
        minutes: 40,
        tags: JSON.stringify(['change']),
      },
    ]);
  });
  logger?.info('seeded the demo maker, admin, pattern and project');
  return true;
}
