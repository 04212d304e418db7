import { Flag } from 'lucide-react';
import { Loading, PageHeader } from '@/components/ui/page';
import { ButtonLink } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { MembersTable } from '@/features/admin/components/members-table';

export default function AdminRoute() {
  const me = useMe();
  if (!me.data) return <Loading />;
  return (
    <>
      <PageHeader
        title="Members"
        subtitle="Look after the people using this Whorlbook. Disabling someone signs them out everywhere at once."
        action={
          <ButtonLink to={paths.adminReports} variant="secondary">
            <Flag aria-hidden className="h-5 w-5" /> Reported content
          </ButtonLink>
        }
      />
      <MembersTable currentUserId={me.data.id} />
    </>
  );
}
