// The Tally's queries all live under 'tally', which is also what the persisted cache keeps for offline use.
export const tallyKeys = {
  all: ['tally'] as const,
  pieces: () => [...tallyKeys.all, 'piece'] as const,
  piece: (pieceId: number) => [...tallyKeys.pieces(), pieceId] as const,
  progress: (pieceId: number) => [...tallyKeys.piece(pieceId), 'progress'] as const,
  history: (pieceId: number) => [...tallyKeys.piece(pieceId), 'history'] as const,
  placements: (pieceId: number) => [...tallyKeys.piece(pieceId), 'placements'] as const,
};
