import crypto from 'node:crypto';
import type { Knex } from 'knex';
import type { User } from 'lucia';
import type { AppContext } from '../context.js';
import { HttpError, notFound } from '../lib/http-error.js';
import { ownedProject } from './ownership.js';
import { notionLabels, type Materials } from '../../src/schemas/materials.js';
import { projectStatusLabels, type ProjectStatus } from '../../src/schemas/common.js';
import { ShareTokenSchema } from '../../src/schemas/share.js';
import { hook } from '../../src/reference/hooks.js';
import { categoryForPly, yarnWeightLabel } from '../../src/reference/yarn-weights.js';
import { cautionsFor } from '../../src/reference/safety.js';
import type { MakerProfile, ShareStatus, Showcase as ShowcaseView, ShowcasePhoto, ShowcaseYarn } from '../../src/types/showcase.js';
import { parseJson, readMaterials } from '../lib/json-columns.js';
import type { PhotoRow } from './photos.js';

export type { MakerProfile, ShareStatus, ShowcasePhoto, ShowcaseView, ShowcaseYarn };

// The showcase: the public, read-only view of a shared project. Everything here is built from an explicit list of
// fields, never by passing rows through, so nothing private (e-mail, recipient, notes, unmarked journal entries)
// can reach a visitor by accident.

type Row = Record<string, any>;

/** 144 random bits, URL-safe: never derived from ids (issue 8 asks for at least 128). */
export const newShareToken = () => crypto.randomBytes(18).toString('base64url');

export const sharePath = (token: string) => `/p/${token}`;
export const profilePath = (makerId: string) => `/m/${makerId}`;

/**
 * A photo's name on one shared link: HMAC-SHA256 of its storage key, keyed by the link's token, cut to 144 bits.
 * Visitors only ever get photos through /media/shared/<token>/<ref>/…, so a new link (or private again) retires
 * every photo URL of the old page at once, and the storage key, which names the owner's own private URL
 * (/media/photos/<key>/…, owner only), never reaches a visitor.
 */
export const sharedPhotoRef = (token: string, storageKey: string) => crypto.createHmac('sha256', token).update(storageKey).digest('base64url').slice(0, 24);
export const SHARED_PHOTO_REF = /^[A-Za-z0-9_-]{24}$/;
export const sharedPhotoUrls = (token: string, storageKey: string) => {
  const base = `/media/shared/${token}/${sharedPhotoRef(token, storageKey)}`;
  return { url: `${base}/display.jpg`, thumbUrl: `${base}/thumb.jpg` };
};

const nowIso = () => new Date().toISOString();



/** Only http(s) links become links: a stored "javascript:" source must never reach an href. */
export function safeHttpUrl(value: unknown): string | null {
  if (typeof value !== 'string' || !value.trim()) return null;
  try {
    const u = new URL(value.trim());
    return u.protocol === 'http:' || u.protocol === 'https:' ? u.toString() : null;
  } catch {
    return null;
  }
}

const PAGE = 'That page';

/**
 * The project behind a share token, if its page may be seen right now: shared by link or publicly, not taken down
 * by an admin, and its maker's account still open. Anything else (private, retired, unknown) is the same 404.
 */
export async function sharedProjectByToken(db: Knex, token: string): Promise<Row> {
  if (!ShareTokenSchema.safeParse(token).success) throw notFound(PAGE);
  const row = await db('projects as p')
    .join('users as u', 'u.id', 'p.owner_id')
    .where('p.share_token', token)
    .whereIn('p.visibility', ['link', 'public'])
    .whereNull('p.showcase_hidden_at')
    .whereNull('u.disabled_at')
    .first('p.*', 'u.display_name as owner_display_name', 'u.email as owner_email', 'u.notify_comments as owner_notify_comments');
  if (!row) throw notFound(PAGE);
  return row;
}

// ---- The public view ---------------------------------------------------------------------------------------




const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
const trimNumber = (n: number) => String(Number(n.toFixed(2)));

function yarnAmount(y: Materials['yarns'][number]): string | null {
  const parts: string[] = [];
  if (y.skeinsUsed !== undefined) parts.push(plural(Number(trimNumber(y.skeinsUsed)), 'skein'));
  // 1 yd = 0.9144 m exactly (international yard, 1959).
  if (y.metersUsed !== undefined) parts.push(`${trimNumber(y.metersUsed)} m (${Math.round(y.metersUsed / 0.9144)} yd)`);
  return parts.length ? parts.join(', ') : null;
}

function yarnOut(y: Materials['yarns'][number]): ShowcaseYarn {
  let weight: ShowcaseYarn['weight'] = null;
  if (y.weight !== undefined) weight = { category: y.weight, label: yarnWeightLabel(y.weight), approximate: false };
  else if (y.ply) {
    // Ply names are a convention, not a standard, so the category is shown as approximate.
    const category = categoryForPly(y.ply);
    if (category !== undefined) weight = { category, label: yarnWeightLabel(category), approximate: true };
  }
  return { name: y.name, colour: y.colour ?? null, fibre: y.fibre ?? null, weight, amount: yarnAmount(y) };
}

/**
 * "Left eye: Body (copy 2), between Rnds 9 and 10, at stitch 14 — 6 stitches apart". The Tally records a mark in
 * the round being worked, and shows a pattern's "between Rnds 9 and 10" note at Rnd 10, so a mark at Rnd 10 sits
 * between Rnds 9 and 10. A mark in the first round has no round before it.
 */
export function placementText(p: { label: string; piece: string; copy: number; copies: number; round: number; step: number | null; note: string | null }) {
  const piece = p.copies > 1 ? `${p.piece} (copy ${p.copy})` : p.piece;
  let text = `${p.label}: ${piece}, ${p.round > 1 ? `between Rnds ${p.round - 1} and ${p.round}` : `in Rnd ${p.round}`}`;
  if (p.step) text += `, at stitch ${p.step}`;
  if (p.note) text += ` — ${p.note}`;
  return text;
}

async function makerHasPublicPage(db: Knex, ownerId: string) {
  const row = await db('projects')
    .where({ owner_id: ownerId, visibility: 'public' })
    .whereNotNull('share_token')
    .whereNull('showcase_hidden_at')
    .first('id');
  return Boolean(row);
}

/**
 * The one rule for which photos a visitor may see, used by the page, the maker profile and the photo route alike:
 * photos of the project itself and photos of journal entries the owner put on the showcase. A photo of an entry
 * that is not on the showcase stays private even when the owner chose it as the cover (the page then opens with
 * the first photo it does show, and the owner's share panel says so).
 */
function visiblePhotoQuery(db: Knex, projectIds: number[]) {
  return db('photos as ph')
    .leftJoin('journal_entries as e', function (this: Knex.JoinClause) {
      this.on('e.id', '=', 'ph.entry_id').andOn('e.project_id', '=', 'ph.project_id');
    })
    .whereIn('ph.project_id', projectIds)
    .andWhere((q) => q.whereNull('ph.entry_id').orWhere('e.on_showcase', true))
    .orderBy([{ column: 'ph.created_at' }, { column: 'ph.id' }])
    .select('ph.*');
}

/** The chosen cover first when the page shows it, else the photos in the order they were added. */
const coverFirst = (rows: Row[], coverId: number | null) => [...rows].sort((a, b) => Number(b.id === coverId) - Number(a.id === coverId));

async function showcasePhotos(db: Knex, project: Row, token: string): Promise<ShowcasePhoto[]> {
  const rows = coverFirst(await visiblePhotoQuery(db, [project.id]), project.cover_photo_id ?? null);
  return rows.map((r, i) => ({
    // A position, not the row id: global ids would tell a visitor how many photos exist elsewhere.
    id: i + 1,
    ...sharedPhotoUrls(token, r.storage_key),
    width: r.width,
    height: r.height,
    alt: r.alt?.trim() || `Photo ${i + 1} of ${project.title}`,
    // Without a chosen cover the page can show, the first photo stands in for it.
    cover: i === 0,
  }));
}

/**
 * The photo a shared photo URL names, while its link is the project's current one and the photo is one the page
 * shows; otherwise 404, the same as for a photo that does not exist.
 */
export async function sharedPhotoByRef(db: Knex, token: string, ref: string): Promise<PhotoRow> {
  if (!SHARED_PHOTO_REF.test(ref)) throw notFound('That photo');
  let project: Row;
  try {
    project = await sharedProjectByToken(db, token);
  } catch {
    throw notFound('That photo');
  }
  const rows: PhotoRow[] = await visiblePhotoQuery(db, [project.id]);
  const photo = rows.find((r) => sharedPhotoRef(token, r.storage_key) === ref);
  if (!photo) throw notFound('That photo');
  return photo;
}

export async function cheerSummary(db: Knex, projectId: number, viewerId: string | null) {
  const { count } = (await db('cheers').where({ project_id: projectId }).count({ count: '*' }).first()) as { count: number };
  const cheered = viewerId ? Boolean(await db('cheers').where({ project_id: projectId, user_id: viewerId }).first('user_id')) : false;
  return { count: Number(count), cheered };
}

export function absoluteUrl(origin: string, path: string) {
  return new URL(path, origin).toString();
}

export async function showcaseView(ctx: AppContext, token: string, viewer: User | null, origin: string): Promise<ShowcaseView> {
  const { db } = ctx;
  const project = await sharedProjectByToken(db, token);
  const materials = readMaterials(project.materials);
  const credit = parseJson<{ title?: string; designerCredit?: string | null; sourceUrl?: string | null } | null>(project.pattern_credit, null);

  const pieceRows: Row[] = await db('project_pieces').where({ project_id: project.id }).orderBy([{ column: 'position' }, { column: 'id' }]);
  const pieceById = new Map(pieceRows.map((p) => [p.id, p]));
  const placementRows: Row[] = pieceRows.length
    ? await db('placements')
        .whereIn('piece_id', pieceRows.map((p) => p.id))
        .orderBy([{ column: 'created_at' }, { column: 'id' }])
    : [];
  placementRows.sort((a, b) => (pieceById.get(a.piece_id)?.position ?? 0) - (pieceById.get(b.piece_id)?.position ?? 0));

  const { minutes } = (await db('journal_entries').where({ project_id: project.id }).sum({ minutes: 'minutes' }).first()) as { minutes: number | null };
  const entries: Row[] = await db('journal_entries')
    .where({ project_id: project.id, on_showcase: true })
    .orderBy([{ column: 'entry_date' }, { column: 'id' }]);
  // Positions, not row ids, for the same reason as the photos'.
  const shown = entries.map((e, i) => ({ id: i + 1, date: e.entry_date as string, body: e.body as string, minutes: (e.minutes ?? null) as number | null, tags: parseJson<string[]>(e.tags, []) }));

  const { count: commentCount } = (await db('comments').where({ project_id: project.id }).whereNull('hidden_at').count({ count: '*' }).first()) as { count: number };

  return {
    token,
    url: absoluteUrl(origin, sharePath(token)),
    visibility: project.visibility,
    title: project.title,
    status: project.status,
    statusLabel: projectStatusLabels[project.status as ProjectStatus] ?? project.status,
    startedOn: project.started_on ?? null,
    finishedOn: project.finished_on ?? null,
    workingMinutes: Number(minutes ?? 0),
    maker: {
      displayName: project.owner_display_name,
      profileUrl: (await makerHasPublicPage(db, project.owner_id)) ? profilePath(project.owner_id) : null,
    },
    pattern: credit?.title
      ? { title: credit.title, designerCredit: credit.designerCredit ?? null, sourceUrl: safeHttpUrl(credit.sourceUrl) }
      : null,
    materials: {
      yarns: materials.yarns.map(yarnOut),
      hooks: materials.hooks.map((h) => ({ ...hook(h.mm), note: h.note ?? null })),
      notions: materials.notions.map((n) => ({ kind: n.kind, label: notionLabels[n.kind], sizeMm: n.sizeMm ?? null, quantity: n.quantity ?? null, note: n.note ?? null })),
    },
    pieces: pieceRows.map((p) => ({ name: p.name, copies: p.copies })),
    placements: placementRows.map((r) => {
      const piece = pieceById.get(r.piece_id);
      const p = { label: r.label, piece: piece?.name ?? 'Piece', copy: r.copy, copies: piece?.copies ?? 1, round: r.round, step: r.step ?? null, note: r.note ?? null };
      return { ...p, text: placementText(p) };
    }),
    changes: shown.filter((e) => e.tags.includes('change')).map(({ id, date, body }) => ({ id, date, body })),
    journal: shown.filter((e) => !e.tags.includes('change')),
    photos: await showcasePhotos(db, project, token),
    cautions: cautionsFor({ forYoungChild: Boolean(project.for_young_child), notions: materials.notions }),
    cheers: await cheerSummary(db, project.id, viewer?.id ?? null),
    commentCount: Number(commentCount),
    viewer: { signedIn: Boolean(viewer), isOwner: viewer?.id === project.owner_id, ownerProjectId: viewer?.id === project.owner_id ? project.id : null },
  };
}

// ---- The owner's side ---------------------------------------------------------------------------------------

/** Makes a new link; the old one stops working at once (it is simply no longer anyone's token). */
export async function rotateShareToken(db: Knex, userId: string, projectId: number) {
  const row = await ownedProject(db, userId, projectId);
  if (row.showcase_hidden_at) {
    throw new HttpError(409, 'An admin took this page down after a report, so it cannot be shared again. Write to the Whorlbook admins if you think that was a mistake.');
  }
  await db('projects').where({ id: row.id }).update({ share_token: newShareToken(), updated_at: nowIso() });
}


/** What the owner's share panel shows: the link, and what friends have done with it. */
export async function shareStatus(db: Knex, userId: string, projectId: number, origin: string): Promise<ShareStatus> {
  const row = await ownedProject(db, userId, projectId);
  const count = async (q: Knex.QueryBuilder) => Number(((await q.count({ count: '*' }).first()) as { count: number }).count);
  const open = row.visibility !== 'private' && row.share_token && !row.showcase_hidden_at;
  // The photos the page shows (not every photo of the project), so the count matches what friends see.
  const shownPhotos: Row[] = await visiblePhotoQuery(db, [row.id]);
  return {
    visibility: row.visibility,
    sharePath: open ? sharePath(row.share_token) : null,
    shareUrl: open ? absoluteUrl(origin, sharePath(row.share_token)) : null,
    profilePath: open && row.visibility === 'public' ? profilePath(row.owner_id) : null,
    hiddenByAdmin: Boolean(row.showcase_hidden_at),
    cheerCount: await count(db('cheers').where({ project_id: row.id })),
    commentCount: await count(db('comments').where({ project_id: row.id }).whereNull('hidden_at')),
    hiddenCommentCount: await count(db('comments').where({ project_id: row.id }).whereNotNull('hidden_at')),
    shownEntryCount: await count(db('journal_entries').where({ project_id: row.id, on_showcase: true })),
    photoCount: shownPhotos.length,
    coverHidden: Boolean(row.cover_photo_id) && !shownPhotos.some((p) => p.id === row.cover_photo_id),
  };
}

export async function getShareSettings(db: Knex, userId: string) {
  const row = await db('users').where({ id: userId }).first('notify_comments');
  return { notifyComments: Boolean(row?.notify_comments ?? true) };
}

export async function updateShareSettings(db: Knex, userId: string, input: { notifyComments: boolean }) {
  await db('users').where({ id: userId }).update({ notify_comments: input.notifyComments, updated_at: nowIso() });
  return getShareSettings(db, userId);
}

// ---- The maker's public profile ----------------------------------------------------------------------------


/** Only projects the maker made public are listed; link-only pages stay unlisted. No public page, no profile. */
export async function makerProfile(db: Knex, makerId: string): Promise<MakerProfile> {
  if (!/^[a-z0-9]{1,64}$/.test(makerId)) throw notFound('That maker');
  const maker = await db('users').where({ id: makerId }).whereNull('disabled_at').first('id', 'display_name');
  if (!maker) throw notFound('That maker');
  const rows: Row[] = await db('projects')
    .where({ owner_id: maker.id, visibility: 'public' })
    .whereNotNull('share_token')
    .whereNull('showcase_hidden_at')
    .orderByRaw('coalesce(finished_on, substr(updated_at, 1, 10)) desc')
    .orderBy('id', 'desc');
  if (!rows.length) throw notFound('That maker');
  const ids = rows.map((r) => r.id);
  const photoRows: Row[] = await visiblePhotoQuery(db, ids);
  const cheerRows: Row[] = await db('cheers').whereIn('project_id', ids).groupBy('project_id').select('project_id').count({ count: '*' });
  const cheersBy = new Map(cheerRows.map((c) => [c.project_id, Number(c.count)]));
  return {
    maker: { id: maker.id, displayName: maker.display_name },
    projects: rows.map((r) => {
      // What the project's own page opens with: its cover if the page shows it, else the first photo it shows.
      const photo = coverFirst(photoRows.filter((p) => p.project_id === r.id), r.cover_photo_id ?? null)[0];
      return {
        title: r.title,
        url: sharePath(r.share_token),
        statusLabel: projectStatusLabels[r.status as ProjectStatus] ?? r.status,
        finishedOn: r.finished_on ?? null,
        cover: photo ? { ...sharedPhotoUrls(r.share_token, photo.storage_key), alt: photo.alt?.trim() || `Photo of ${r.title}` } : null,
        cheerCount: cheersBy.get(r.id) ?? 0,
      };
    }),
  };
}
