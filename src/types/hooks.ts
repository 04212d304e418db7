// What the hook roll API answers with (GET/POST /api/hooks, PATCH /api/hooks/:id).
import type { HookMaterial } from '@/schemas/hooks';

export interface RollHook {
  id: number;
  mm: number;
  /** US letter/number from the Craft Yarn Council chart (src/reference/hooks.ts), or null for a size it does not name. */
  us: string | null;
  material: HookMaterial | null;
  brand: string | null;
  note: string | null;
  quantity: number;
  createdAt: string;
  updatedAt: string;
}
