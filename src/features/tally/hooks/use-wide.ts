import { useSyncExternalStore } from 'react';

// Tablet width and up (Tailwind's md): room for the silhouette beside the tap zone. Rendered only there, so a
// phone does not redraw a hidden silhouette on every tap.
const QUERY = '(min-width: 768px)';

let list: MediaQueryList | null = null;
// One MediaQueryList for the app: asking matchMedia on every render costs more than the render.
const media = () => (typeof matchMedia === 'function' ? (list ??= matchMedia(QUERY)) : null);
const subscribe = (fn: () => void) => {
  const m = media();
  m?.addEventListener?.('change', fn);
  return () => m?.removeEventListener?.('change', fn);
};
const read = () => media()?.matches ?? false;

export const useWide = () => useSyncExternalStore(subscribe, read, () => false);
