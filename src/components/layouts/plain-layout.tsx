import { Link, Outlet } from 'react-router-dom';
import { WhorlMark } from './whorl-mark';

/** For pages without the signed-in shell: sign-in, sign-up, password reset. */
export function PlainLayout() {
  return (
    <div className="flex min-h-dvh flex-col items-center px-4 py-8">
      <Link to="/" className="mb-6 flex min-h-tap items-center gap-2 text-2xl font-bold">
        <WhorlMark className="h-10 w-10" />
        Whorlbook
      </Link>
      <main className="w-full max-w-md">
        <Outlet />
      </main>
    </div>
  );
}
