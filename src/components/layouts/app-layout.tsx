import { NavLink, Outlet, useNavigate } from 'react-router-dom';
import { BookOpen, Home, Layers, Moon, Sun, Shield, LogOut, User } from 'lucide-react';
import type { ReactNode } from 'react';
import { useMe } from '@/features/auth/api/get-me';
import { useSignOut } from '@/features/auth/api/sign-out';
import { VerifyEmailBanner } from '@/features/auth/components/verify-email-banner';
import { useTheme } from '@/hooks/use-theme';
import { paths } from '@/config/paths';
import { cn } from '@/utils/cn';
import { WhorlMark } from './whorl-mark';

function NavItem({ to, icon, children, end }: { to: string; icon: ReactNode; children: ReactNode; end?: boolean }) {
  return (
    <NavLink
      to={to}
      end={end}
      className={({ isActive }) =>
        cn(
          'flex min-h-tap min-w-tap flex-1 flex-col items-center justify-center gap-0.5 rounded-soft px-2 text-xs font-semibold sm:flex-none sm:flex-row sm:gap-2 sm:px-4 sm:text-base',
          isActive ? 'bg-moss text-oat' : 'text-ink hover:bg-wool dark:text-oat dark:hover:bg-white/10',
        )
      }
    >
      {icon}
      <span>{children}</span>
    </NavLink>
  );
}

/** The signed-in shell: a top bar on wide screens, a thumb-reach bar at the bottom on phones. */
export function AppLayout() {
  const me = useMe();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const { theme, toggle } = useTheme();
  const icon = 'h-5 w-5';
  const nav = (
    <>
      <NavItem to={paths.home} end icon={<Home aria-hidden className={icon} />}>On the hook</NavItem>
      <NavItem to={paths.projects} icon={<Layers aria-hidden className={icon} />}>Projects</NavItem>
      <NavItem to={paths.patterns} icon={<BookOpen aria-hidden className={icon} />}>Patterns</NavItem>
      <NavItem to={paths.account} icon={<User aria-hidden className={icon} />}>Me</NavItem>
    </>
  );
  return (
    <div className="min-h-dvh pb-24 sm:pb-8">
      <header className="sticky top-0 z-20 border-b border-wool bg-oat/95 backdrop-blur dark:border-[#4a423c] dark:bg-ink/95">
        <div className="mx-auto flex max-w-5xl items-center gap-3 px-4 py-2">
          <NavLink to={paths.home} className="flex min-h-tap items-center gap-2 text-xl font-bold" aria-label="Whorlbook home">
            <WhorlMark className="h-8 w-8" />
            <span>Whorlbook</span>
          </NavLink>
          <nav aria-label="Main" className="ml-4 hidden gap-1 sm:flex">{nav}</nav>
          <div className="ml-auto flex items-center gap-1">
            {me.data?.role === 'admin' ? (
              <NavLink to={paths.admin} className="flex min-h-tap min-w-tap items-center justify-center rounded-soft hover:bg-wool dark:hover:bg-white/10" aria-label="Admin">
                <Shield aria-hidden className={icon} />
              </NavLink>
            ) : null}
            <button
              type="button"
              onClick={toggle}
              className="flex min-h-tap min-w-tap items-center justify-center rounded-soft hover:bg-wool dark:hover:bg-white/10"
              aria-label={theme === 'dark' ? 'Use the light theme' : 'Use the dark theme for evening work'}
            >
              {theme === 'dark' ? <Sun aria-hidden className={icon} /> : <Moon aria-hidden className={icon} />}
            </button>
            <button
              type="button"
              onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate(paths.signIn) })}
              className="flex min-h-tap min-w-tap items-center justify-center gap-2 rounded-soft px-2 font-semibold hover:bg-wool dark:hover:bg-white/10"
            >
              <LogOut aria-hidden className={icon} />
              <span className="hidden sm:inline">Sign out</span>
              <span className="sr-only sm:hidden">Sign out</span>
            </button>
          </div>
        </div>
      </header>
      <main id="main" className="mx-auto max-w-5xl px-4 py-5">
        <VerifyEmailBanner />
        <Outlet />
      </main>
      <nav aria-label="Main" className="fixed inset-x-0 bottom-0 z-20 flex gap-1 border-t border-wool bg-oat/95 p-2 pb-[max(0.5rem,env(safe-area-inset-bottom))] backdrop-blur sm:hidden dark:border-[#4a423c] dark:bg-ink/95">
        {nav}
      </nav>
    </div>
  );
}
