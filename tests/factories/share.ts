import crypto from 'node:crypto';
import type { Knex } from 'knex';

// A finished project of our own with everything a showcase shows, and a few things it must never show:
// a private journal entry, a private "change", the recipient, the maker's own notes and a photo on a private entry.

export const PRIVATE_MARKERS = {
  recipient: 'my neighbour Odile',
  notes: 'PRIVATE-NOTES: half the eyes came from the spare box',
  entry: 'PRIVATE-ENTRY: buying the second skein on payday',
  change: 'PRIVATE-CHANGE: swapped the stuffing brand',
};

let n = 0;

export interface ShowcaseFixture {
  id: number;
  token: string;
  coverKey: string;
  shownEntryPhotoKey: string;
  privateEntryPhotoKey: string;
  pieceIds: { body: number; ear: number };
}

// The same shape as server-made storage keys (18 random bytes, base64url).
const key = () => crypto.randomBytes(18).toString('base64url');

export async function createShowcaseProject(
  db: Knex,
  ownerId: string,
  overrides: Partial<{ title: string; visibility: 'private' | 'link' | 'public'; forYoungChild: boolean; withPhotos: boolean; patternCredit: Record<string, unknown> | null }> = {},
): Promise<ShowcaseFixture> {
  n += 1;
  const token = crypto.randomBytes(18).toString('base64url');
  const [{ id }] = await db('projects')
    .insert({
      owner_id: ownerId,
      title: overrides.title ?? `Moss the hedgehog no. ${n}`,
      status: 'finished',
      terms: 'us',
      pattern_credit: JSON.stringify(
        overrides.patternCredit === undefined ? { title: 'Round-back hedgehog', designerCredit: 'Pip & Bramble Studio', sourceUrl: 'https://patterns.example/hedgehog' } : overrides.patternCredit,
      ),
      started_on: '2026-11-02',
      finished_on: '2026-11-20',
      recipient: PRIVATE_MARKERS.recipient,
      for_young_child: overrides.forYoungChild ?? false,
      materials: JSON.stringify({
        yarns: [
          { name: 'Cotton 8', colour: 'Moss green', fibre: 'cotton', weight: 3, skeinsUsed: 1.5 },
          { name: 'Soft acrylic', colour: 'Oat', ply: '8 ply', metersUsed: 40 },
        ],
        hooks: [{ mm: 3.5 }, { mm: 2.5, note: 'for the nose' }],
        notions: [
          { kind: 'safety_eyes', sizeMm: 8, quantity: 2 },
          { kind: 'stuffing', note: 'about 30 g' },
        ],
      }),
      notes: PRIVATE_MARKERS.notes,
      visibility: overrides.visibility ?? 'link',
      share_token: token,
    })
    .returning('id');
  const [{ id: body }, { id: ear }] = await db('project_pieces')
    .insert([
      { project_id: id, position: 0, name: 'Body', copies: 1, instructions: 'Rnd 1: 6 sc in MR (6)' },
      { project_id: id, position: 1, name: 'Ear', copies: 2, instructions: 'Rnd 1: 4 sc in MR (4)' },
    ])
    .returning('id');
  await db('placements').insert([
    { piece_id: body, copy: 1, round: 10, step: 14, label: 'Left eye', note: '6 stitches apart' },
    { piece_id: ear, copy: 2, round: 3, step: null, label: 'Ear', note: null },
  ]);
  const entries = await db('journal_entries')
    .insert([
      { project_id: id, author_id: ownerId, body: 'Body done, **so round**.', entry_date: '2026-11-05', minutes: 60, tags: JSON.stringify(['progress']), on_showcase: true },
      { project_id: id, author_id: ownerId, body: PRIVATE_MARKERS.entry, entry_date: '2026-11-06', minutes: 30, tags: JSON.stringify(['progress']), on_showcase: false },
      { project_id: id, author_id: ownerId, body: 'Worked Rnds 7–12 with a 3.25 mm hook for a firmer fabric.', entry_date: '2026-11-07', minutes: 45, tags: JSON.stringify(['change']), on_showcase: true },
      { project_id: id, author_id: ownerId, body: PRIVATE_MARKERS.change, entry_date: '2026-11-08', minutes: null, tags: JSON.stringify(['change']), on_showcase: false },
    ])
    .returning('id');
  const [shownEntry, privateEntry] = [entries[0].id, entries[1].id];
  const fixture: ShowcaseFixture = { id, token, coverKey: key(), shownEntryPhotoKey: key(), privateEntryPhotoKey: key(), pieceIds: { body, ear } };
  if (overrides.withPhotos ?? true) {
    const photo = (storage_key: string, entry_id: number | null, alt: string) => ({ project_id: id, entry_id, owner_id: ownerId, storage_key, width: 1600, height: 1200, bytes: 1000, alt });
    const rows = await db('photos')
      .insert([
        photo(fixture.shownEntryPhotoKey, shownEntry, 'The body after stuffing'),
        photo(fixture.privateEntryPhotoKey, privateEntry, 'Receipt for the yarn'),
        photo(fixture.coverKey, null, 'Moss the hedgehog on a windowsill'),
      ])
      .returning('id');
    await db('projects').where({ id }).update({ cover_photo_id: rows[2].id });
  }
  return fixture;
}
