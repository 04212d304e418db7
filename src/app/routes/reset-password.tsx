import { useSearchParams } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { ButtonLink } from '@/components/ui/button';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form';
import { paths } from '@/config/paths';

export default function ResetPasswordRoute() {
  const [search] = useSearchParams();
  const token = search.get('token');
  return (
    <Card>
      <h1 className="mb-1 text-2xl font-bold">Choose a new password</h1>
      {token ? (
        <>
          <p className="mb-5 text-ink/70 dark:text-oat/70">Saving it signs you out on every device; then you sign in with the new one.</p>
          <ResetPasswordForm token={token} />
        </>
      ) : (
        <div className="mt-4 flex flex-col gap-4">
          <Banner tone="warning" title="This page needs the link from your e-mail">
            Open the reset link from the e-mail we sent, or ask for a new one.
          </Banner>
          <ButtonLink to={paths.forgotPassword}>Ask for a reset link</ButtonLink>
        </div>
      )}
    </Card>
  );
}
