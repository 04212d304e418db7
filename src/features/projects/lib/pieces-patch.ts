import type { ProjectPieceFormOutput, UpdateProjectInput } from '@/schemas/project';
import type { ProjectPiece } from '@/types/api';

// PATCH /api/projects/:id takes the whole list of pieces: the ones sent with an id stay (fields left out are
// kept), the ones without an id are added, the ones left out are removed. These build that list for one change.

type PiecesPatch = NonNullable<UpdateProjectInput['pieces']>;

// Only the id and name of a piece that is not being changed, so nothing else of it can be overwritten.
const keep = (p: ProjectPiece) => ({ id: p.id, name: p.name });

/** The list with one piece changed (by id) or, without an id, added at the end. */
export function piecesWith(pieces: ProjectPiece[], values: ProjectPieceFormOutput): PiecesPatch {
  const { id, ...fields } = values;
  if (id === undefined) return [...pieces.map(keep), fields];
  return pieces.map((p) => (p.id === id ? { id, ...fields } : keep(p)));
}

export const piecesWithout = (pieces: ProjectPiece[], id: number): PiecesPatch => pieces.filter((p) => p.id !== id).map(keep);

/** The list with one piece moved one place earlier (-1) or later (+1). */
export function piecesMoved(pieces: ProjectPiece[], id: number, by: -1 | 1): PiecesPatch {
  const list = pieces.map(keep);
  const from = list.findIndex((p) => p.id === id);
  const to = from + by;
  if (from < 0 || to < 0 || to >= list.length) return list;
  [list[from], list[to]] = [list[to], list[from]];
  return list;
}

/** Where a piece sits in the list sent: the index the server's field errors (pieces.N.field) point at. */
export const sentIndex = (pieces: ProjectPiece[], id: number | undefined) => (id === undefined ? pieces.length : pieces.findIndex((p) => p.id === id));
