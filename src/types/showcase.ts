// Shapes of the showcase API's answers: server/services/share.ts, comments.ts and reports.ts serialize exactly these,
// and the client reads them. One definition for both sides.
import type { NotionKind } from '@/schemas/materials';
import type { ProjectStatus } from '@/schemas/common';
import type { Caution } from './api';

export type ShowcaseCaution = Caution;

export interface ShowcasePhoto {
  id: number;
  url: string;
  thumbUrl: string;
  width: number;
  height: number;
  alt: string;
  cover: boolean;
}

export interface ShowcaseYarn {
  name: string;
  colour: string | null;
  fibre: string | null;
  weight: { category: number; label: string; approximate: boolean } | null;
  amount: string | null;
}

export interface Showcase {
  token: string;
  /** Absolute link to this page. */
  url: string;
  visibility: 'link' | 'public';
  title: string;
  status: ProjectStatus;
  statusLabel: string;
  startedOn: string | null;
  finishedOn: string | null;
  workingMinutes: number;
  maker: { displayName: string; profileUrl: string | null };
  pattern: { title: string; designerCredit: string | null; sourceUrl: string | null } | null;
  materials: {
    yarns: ShowcaseYarn[];
    hooks: Array<{ mm: number; us: string | null; note: string | null }>;
    notions: Array<{ kind: NotionKind; label: string; sizeMm: number | null; quantity: number | null; note: string | null }>;
  };
  pieces: Array<{ name: string; copies: number }>;
  placements: Array<{ label: string; piece: string; copy: number; copies: number; round: number; step: number | null; note: string | null; text: string }>;
  changes: Array<{ id: number; date: string; body: string }>;
  journal: Array<{ id: number; date: string; body: string; minutes: number | null; tags: string[] }>;
  photos: ShowcasePhoto[];
  cautions: ShowcaseCaution[];
  cheers: CheerSummary;
  commentCount: number;
  /** ownerProjectId lets the owner jump back to their project; it is null for everyone else. */
  viewer: { signedIn: boolean; isOwner: boolean; ownerProjectId: number | null };
}

export interface CheerSummary {
  count: number;
  cheered: boolean;
}

export interface ShowcaseComment {
  id: number;
  body: string;
  author: { displayName: string };
  createdAt: string;
  hidden: boolean;
  /** Hidden by an admin after a report: the owner cannot show it again. */
  hiddenByAdmin: boolean;
  mine: boolean;
  canDelete: boolean;
  canHide: boolean;
}

export interface ShareStatus {
  visibility: 'private' | 'link' | 'public';
  sharePath: string | null;
  shareUrl: string | null;
  /** The owner's public maker page, while this project is listed on it. */
  profilePath: string | null;
  hiddenByAdmin: boolean;
  cheerCount: number;
  commentCount: number;
  hiddenCommentCount: number;
  shownEntryCount: number;
  /** Photos the page shows: the project's own and those of entries on the showcase. */
  photoCount: number;
  /** The chosen cover is in a journal entry the page does not show, so the page opens with another photo. */
  coverHidden?: boolean;
}

export interface MakerProfile {
  maker: { id: string; displayName: string };
  projects: Array<{ title: string; url: string; statusLabel: string; finishedOn: string | null; cover: { url: string; thumbUrl: string; alt: string } | null; cheerCount: number }>;
}

export interface Report {
  id: number;
  target: 'comment' | 'project';
  reason: string;
  status: 'open' | 'hidden' | 'dismissed';
  createdAt: string;
  handledAt: string | null;
  reporter: { displayName: string };
  handledBy: { displayName: string } | null;
  page: { title: string; path: string | null; ownerDisplayName: string; hidden: boolean } | null;
  comment: { id: number; body: string; authorDisplayName: string; hidden: boolean } | null;
  /** Open reports on the same comment or page, this one included. */
  openReportsOnTarget: number;
}
