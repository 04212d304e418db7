import { Navigate } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { Loading } from '@/components/ui/page';
import { SignUpForm } from '@/features/auth/components/sign-up-form';
import { useMe } from '@/features/auth/api/get-me';
import { paths } from '@/config/paths';

export default function SignUpRoute() {
  const me = useMe();
  if (me.isPending) return <Loading />;
  if (me.data) return <Navigate to={paths.home} replace />;
  return (
    <Card>
      <h1 className="mb-1 text-2xl font-bold">Make your Whorlbook account</h1>
      <p className="mb-5 text-ink/70 dark:text-oat/70">Keep every pattern, count and placement in one place, on the phone beside your hook.</p>
      <SignUpForm />
    </Card>
  );
}
