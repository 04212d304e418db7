import { useCallback, useSyncExternalStore } from 'react';

// The maker's Tally preferences, kept on this device (a phone and a tablet may well want different ones).

export interface TallySettings {
  /** Count every stitch, or only tap at the end of each round. */
  mode: 'stitch' | 'round';
  vibrate: boolean;
  /** A soft click on each tap; off unless asked for (many count beside someone asleep). */
  sound: boolean;
  highContrast: boolean;
  keepAwake: boolean;
}

export const defaultSettings: TallySettings = {
  mode: 'stitch',
  vibrate: true,
  sound: false,
  highContrast: false,
  keepAwake: true,
};

const KEY = 'whorlbook.tally.settings';
const listeners = new Set<() => void>();
let cached: TallySettings | null = null;

function read(): TallySettings {
  if (cached) return cached;
  let stored: Partial<TallySettings> = {};
  try {
    stored = JSON.parse(localStorage.getItem(KEY) ?? '{}') as Partial<TallySettings>;
  } catch {
    /* blocked or broken storage: the defaults will do */
  }
  cached = {
    mode: stored.mode === 'round' ? 'round' : 'stitch',
    vibrate: typeof stored.vibrate === 'boolean' ? stored.vibrate : defaultSettings.vibrate,
    sound: typeof stored.sound === 'boolean' ? stored.sound : defaultSettings.sound,
    highContrast:
      typeof stored.highContrast === 'boolean' ? stored.highContrast : defaultSettings.highContrast,
    keepAwake: typeof stored.keepAwake === 'boolean' ? stored.keepAwake : defaultSettings.keepAwake,
  };
  return cached;
}

export function saveSettings(patch: Partial<TallySettings>) {
  cached = { ...read(), ...patch };
  try {
    localStorage.setItem(KEY, JSON.stringify(cached));
  } catch {
    /* kept for this visit only */
  }
  for (const fn of listeners) fn();
}

const subscribe = (fn: () => void) => {
  listeners.add(fn);
  return () => listeners.delete(fn);
};

export function useTallySettings() {
  const settings = useSyncExternalStore(subscribe, read, read);
  const set = useCallback((patch: Partial<TallySettings>) => saveSettings(patch), []);
  return [settings, set] as const;
}
