import { PageHeader } from '@/components/ui/page';
import { ReportsQueue } from '@/features/showcase/components/reports-queue';

/** /admin/reports — reported comments and showcase pages, for the admins to hide or dismiss. */
export default function AdminReportsRoute() {
  return (
    <>
      <PageHeader title="Reports" subtitle="Comments and pages members asked an admin to look at." />
      <ReportsQueue />
    </>
  );
}
