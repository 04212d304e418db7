import { MailedLinkCard } from '@/features/auth/components/mailed-link-card';
import { useVerifyEmail } from '@/features/auth/api/verify-email';
import { paths } from '@/config/paths';

export default function VerifyEmailRoute() {
  const verify = useVerifyEmail();
  return (
    <MailedLinkCard
      title="Confirm your e-mail"
      mutation={verify}
      working="Confirming your e-mail…"
      done={(data) => ({
        title: 'E-mail confirmed',
        body: (
          <>
            Thank you. <span className="font-semibold">{data.email}</span> is confirmed.
          </>
        ),
      })}
      failed="Not confirmed"
      incompleteHint="Signed-in members can ask for a new link from the banner at the top of Whorlbook."
      signedInOnward={{ to: paths.home, label: 'Go to On the hook' }}
    />
  );
}
