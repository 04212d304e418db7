import { Loading, PageHeader } from '@/components/ui/page';
import { useMe } from '@/features/auth/api/get-me';
import { MembersTable } from '@/features/admin/components/members-table';

export default function AdminRoute() {
  const me = useMe();
  if (!me.data) return <Loading />;
  return (
    <>
      <PageHeader title="Members" subtitle="Look after the people using this Whorlbook. Disabling someone signs them out everywhere at once." />
      <MembersTable currentUserId={me.data.id} />
    </>
  );
}
