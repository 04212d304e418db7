import type { RollHook } from '@/types/hooks';

// Sizes are stored to two decimals, so anything closer than a hundredth of a millimetre is the same hook.
const SAME_MM = 0.005;

/** The maker's hooks of this size (several brands or materials can share one size). */
export function hooksOfSize(hooks: readonly RollHook[], mm: number) {
  return hooks.filter((h) => Math.abs(h.mm - mm) < SAME_MM);
}

/** Smallest first, the order a roll is kept in; the same size keeps the order it was added in. */
export function bySize(hooks: readonly RollHook[]) {
  return [...hooks].sort((a, b) => a.mm - b.mm || a.id - b.id);
}

/** How many hooks in all, counting each one of several of the same kind. */
export const hookCount = (hooks: readonly RollHook[]) => hooks.reduce((n, h) => n + h.quantity, 0);
