import { CheckCircle2, MailWarning } from 'lucide-react';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Loading, PageHeader } from '@/components/ui/page';
import { useMe } from '@/features/auth/api/get-me';
import { useResendVerification } from '@/features/auth/api/resend-verification';
import { ChangePasswordForm } from '@/features/auth/components/change-password-form';
import { DeleteAccountForm } from '@/features/auth/components/delete-account-form';
import { ChangeEmailForm } from '@/features/auth/components/change-email-form';

function EmailStatus({ verified }: { verified: boolean }) {
  const resend = useResendVerification();
  if (verified) {
    return (
      <p className="flex items-center gap-2 font-semibold text-moss dark:text-[#9cc3a8]">
        <CheckCircle2 aria-hidden className="h-5 w-5" /> Confirmed
      </p>
    );
  }
  return (
    <div className="flex flex-col gap-2">
      <p className="flex items-center gap-2 font-semibold text-clay-dark dark:text-[#e59a7c]">
        <MailWarning aria-hidden className="h-5 w-5" /> Not confirmed yet
      </p>
      {resend.isSuccess ? <p role="status">✓ {resend.data.message}</p> : null}
      {resend.error ? (
        <p role="alert" className="font-semibold text-clay-dark">
          <span aria-hidden>⚠ </span>
          {resend.error.message}
        </p>
      ) : null}
      <Button variant="secondary" className="self-start" pending={resend.isPending} onClick={() => resend.mutate()}>
        Send the confirmation link again
      </Button>
    </div>
  );
}

export default function AccountRoute() {
  const me = useMe();
  if (!me.data) return <Loading />;
  const user = me.data;
  return (
    <>
      <PageHeader title="Me" subtitle="Your account and how you sign in." />
      <div className="grid gap-5 lg:grid-cols-2">
        <Card>
          <h2 className="mb-3 text-xl font-bold">Account</h2>
          <dl className="grid gap-3">
            <div>
              <dt className="text-sm font-semibold text-ink/70 dark:text-oat/70">Name</dt>
              <dd className="text-lg">{user.displayName}</dd>
            </div>
            <div>
              <dt className="text-sm font-semibold text-ink/70 dark:text-oat/70">E-mail</dt>
              <dd className="break-all text-lg">{user.email}</dd>
            </div>
            <div>
              <dt className="text-sm font-semibold text-ink/70 dark:text-oat/70">E-mail status</dt>
              <dd>
                <EmailStatus verified={user.emailVerified} />
              </dd>
            </div>
            {user.role === 'admin' ? (
              <div>
                <dt className="text-sm font-semibold text-ink/70 dark:text-oat/70">Role</dt>
                <dd>Admin</dd>
              </div>
            ) : null}
          </dl>
        </Card>
        <Card>
          <h2 className="mb-3 text-xl font-bold">Change your password</h2>
          <ChangePasswordForm />
        </Card>
        <Card>
          <h2 className="mb-3 text-xl font-bold">Change your e-mail</h2>
          <ChangeEmailForm />
        </Card>
        <Card>
          <h2 className="mb-3 text-xl font-bold">Delete your account</h2>
          <DeleteAccountForm />
        </Card>
      </div>
    </>
  );
}
