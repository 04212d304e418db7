import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Moon, Sun } from 'lucide-react';
import { WhorlMark } from '@/components/layouts/whorl-mark';
import { useTheme } from '@/hooks/use-theme';

/** The thin bar over public pages (showcase, maker profile): our mark, the theme, and whatever the page adds. */
export function PublicShell({ children, action }: { children: ReactNode; action?: ReactNode }) {
  const { theme, toggle } = useTheme();
  return (
    <div className="min-h-dvh bg-oat text-ink dark:bg-ink dark:text-oat print:bg-white">
      <header className="print:hidden">
        <div className="mx-auto flex max-w-3xl items-center gap-2 px-4 py-2">
          <Link to="/" className="flex min-h-tap items-center gap-2 text-lg font-bold" aria-label="Whorlbook">
            <WhorlMark className="h-8 w-8" />
            <span>Whorlbook</span>
          </Link>
          <div className="ml-auto flex items-center gap-1">
            {action}
            <button
              type="button"
              onClick={toggle}
              className="flex min-h-tap min-w-tap items-center justify-center rounded-soft hover:bg-wool dark:hover:bg-white/10"
              aria-label={theme === 'dark' ? 'Use the light theme' : 'Use the dark theme'}
            >
              {theme === 'dark' ? <Sun aria-hidden className="h-5 w-5" /> : <Moon aria-hidden className="h-5 w-5" />}
            </button>
          </div>
        </div>
      </header>
      <main id="main">{children}</main>
    </div>
  );
}
