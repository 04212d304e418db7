import { MailedLinkCard } from '@/features/auth/components/mailed-link-card';
import { useConfirmEmailChange } from '@/features/auth/api/change-email';
import { paths } from '@/config/paths';

/** Opened from the link sent to a new address; opening it is the confirmation. */
export default function ChangeEmailRoute() {
  const confirm = useConfirmEmailChange();
  return (
    <MailedLinkCard
      title="Your new e-mail"
      mutation={confirm}
      working="Changing your e-mail…"
      done={(data) => ({ title: 'E-mail changed', body: data.message })}
      failed="Not changed"
      signedInOnward={{ to: paths.account, label: 'Go to Me' }}
    />
  );
}
