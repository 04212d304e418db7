import { Navigate } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { Loading } from '@/components/ui/page';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { useMe } from '@/features/auth/api/get-me';
import { paths } from '@/config/paths';

export default function SignInRoute() {
  const me = useMe();
  if (me.isPending) return <Loading />;
  if (me.data) return <Navigate to={paths.home} replace />;
  return (
    <Card>
      <h1 className="mb-1 text-2xl font-bold">Welcome back</h1>
      <p className="mb-5 text-ink/70 dark:text-oat/70">Sign in to pick up your work where you left it.</p>
      <SignInForm />
    </Card>
  );
}
