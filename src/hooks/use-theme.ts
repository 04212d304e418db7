import { useCallback, useState } from 'react';

export type Theme = 'light' | 'dark';
const KEY = 'whorlbook.theme';

function readTheme(): Theme {
  try {
    const stored = localStorage.getItem(KEY);
    if (stored === 'light' || stored === 'dark') return stored;
  } catch {
    /* storage may be blocked; fall back to the system setting */
  }
  return typeof matchMedia === 'function' && matchMedia('(prefers-color-scheme: dark)').matches ? 'dark' : 'light';
}

export function applyStoredTheme() {
  document.documentElement.classList.toggle('dark', readTheme() === 'dark');
}

/** Light (oat) or dark (ink, for evening work), remembered on this device. */
export function useTheme() {
  const [theme, setTheme] = useState<Theme>(readTheme);
  const choose = useCallback((next: Theme) => {
    setTheme(next);
    try {
      localStorage.setItem(KEY, next);
    } catch {
      /* ignore */
    }
    document.documentElement.classList.toggle('dark', next === 'dark');
  }, []);
  return { theme, setTheme: choose, toggle: () => choose(theme === 'dark' ? 'light' : 'dark') };
}
