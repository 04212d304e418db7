import { apiPost } from '@/lib/api-client';
import type { ProgressOp } from '@/schemas/progress';
import type { PieceProgress } from '@/types/api';

/** One tap to the server. Only the outbox calls this, so every tap is queued, kept and sent in order. */
export const postProgress = async (pieceId: number, op: ProgressOp) =>
  (await apiPost<{ progress: PieceProgress }>(`/pieces/${pieceId}/progress`, op)).progress;
