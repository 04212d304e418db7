// Shapes the API answers with, shared by the client features (and matched by the server's serializers).
// Additive changes only: several screens read these.
import type { Materials, Yarn } from '@/schemas/materials';
import type { ProjectStatus } from '@/schemas/common';
import type { Terms } from '@/engine/types';
import type { JournalTag } from '@/schemas/journal';

export interface HookOut {
  mm: number;
  us: string | null;
}

export interface RoundCheckOut {
  number: number;
  label: string;
  line: number;
  stitches: number;
  worked: number;
  stated: number | null;
  problems: Array<{ message: string; column: number | null; severity: 'error' | 'warning' }>;
}

/** What a pattern's piece and a project's copy of it have in common. */
export interface PieceBase {
  id: number;
  position: number;
  name: string;
  copies: number;
  hookMm: number | null;
  hook: HookOut | null;
  yarns: string[];
  instructions: string;
}

export interface PatternPiece extends PieceBase {
  check: { rounds: RoundCheckOut[]; problemCount: number };
}

export interface Gauge {
  stitches: number;
  rows: number;
  over: '10cm' | '4in';
  stitch?: string;
  hookMm?: number;
}

export interface Pattern {
  id: number;
  title: string;
  designerCredit: string | null;
  sourceUrl: string | null;
  terms: Terms;
  gauge: Gauge | null;
  skillNotes: string | null;
  materials: Materials;
  visibility: 'private' | 'testers' | 'public';
  /** True when the signed-in member owns it (others may only read a public pattern). */
  mine: boolean;
  pieces: PatternPiece[];
  cautions: Caution[];
  createdAt: string;
  updatedAt: string;
}

/** A light row of GET /api/patterns. */
export interface PatternListItem {
  id: number;
  title: string;
  designerCredit: string | null;
  pieceCount: number;
  problemCount: number;
  updatedAt: string;
  visibility: 'private' | 'testers' | 'public';
}

export interface Caution {
  code: string;
  title: string;
  message: string;
}

export interface PieceProgress {
  /** 1-based copy being worked. */
  copy: number;
  /** 0-based index into the piece's checked rounds. */
  round: number;
  /** Steps done in the current round. */
  step: number;
  /** Total steps completed on this piece across all copies. */
  done: number;
  version: number;
  updatedAt: string | null;
}

export interface Placement {
  id: number;
  pieceId: number;
  copy: number;
  round: number;
  step: number | null;
  label: string;
  note: string | null;
  createdAt: string;
}

export interface ProjectPiece extends PieceBase {
  progress: PieceProgress;
  /** From the stitch engine over this piece's own instructions. */
  totals: { rounds: number; stepsPerCopy: number; copiesDone: number; roundsDone: number };
  placements: Placement[];
}

export interface PhotoOut {
  id: number;
  url: string;
  thumbUrl: string;
  width: number;
  height: number;
  alt: string;
}

/** A photo as the journal lists it: PhotoOut plus whether it is the project's cover. */
export interface JournalPhoto extends PhotoOut {
  entryId: number;
  cover: boolean;
}

export interface JournalEntry {
  id: number;
  projectId: number;
  pieceId: number | null;
  pieceName: string | null;
  body: string;
  /** YYYY-MM-DD, the maker's day. */
  entryDate: string;
  minutes: number | null;
  tags: JournalTag[];
  onShowcase: boolean;
  photos: JournalPhoto[];
  createdAt: string;
  updatedAt: string;
}

export interface ProjectListItem {
  id: number;
  title: string;
  status: ProjectStatus;
  startedOn: string | null;
  finishedOn: string | null;
  updatedAt: string;
  pieceCount: number;
  recipient: string | null;
  patternTitle: string | null;
  forYoungChild: boolean;
  visibility: 'private' | 'link' | 'public';
  /** How many cautions the project page will show (small parts, young child). */
  cautionCount: number;
}

export interface Project {
  id: number;
  title: string;
  status: ProjectStatus;
  patternId: number | null;
  patternCredit: { title: string; designerCredit: string | null; sourceUrl: string | null } | null;
  terms: Terms;
  startedOn: string | null;
  finishedOn: string | null;
  recipient: string | null;
  forYoungChild: boolean;
  materials: Materials;
  notes: string | null;
  visibility: 'private' | 'link' | 'public';
  /** Absolute link (or a path starting with /p/) while shared; null when private. */
  shareUrl: string | null;
  coverPhoto: PhotoOut | null;
  pieces: ProjectPiece[];
  cautions: Caution[];
  createdAt: string;
  updatedAt: string;
}

export interface ShelfYarn extends Yarn {
  id: number;
  skeinsOwned: number;
  /** Meters left on the shelf, when known (skeins owned × meters per skein − meters used in projects). */
  metersLeft: number | null;
  yardsLeft: number | null;
  notes: string | null;
}
