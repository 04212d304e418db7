import { Link } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';
import { useOutbox } from '@/features/dev/api/get-outbox';
import { paths } from '@/config/paths';

/** While this server uses its built-in mail fake, point a person trying Whorlbook at the place the e-mail lands. */
function OutboxHint() {
  const outbox = useOutbox();
  if (!outbox.data) return null;
  return (
    <p className="text-sm">
      This Whorlbook keeps its e-mail on this computer.{' '}
      <Link className="inline-flex min-h-tap items-center font-semibold text-moss underline dark:text-[#9cc3a8]" to={paths.outbox}>
        Open the outbox
      </Link>
    </p>
  );
}

export default function ForgotPasswordRoute() {
  return (
    <Card>
      <h1 className="mb-1 text-2xl font-bold">Forgot your password?</h1>
      <p className="mb-5 text-ink/70 dark:text-oat/70">Tell us the e-mail you signed up with and we will send a link to choose a new password.</p>
      <ForgotPasswordForm afterSent={<OutboxHint />} />
    </Card>
  );
}
