import { useParams } from 'react-router-dom';
import { ApiError } from '@/lib/api-client';
import { EmptyState, Loading } from '@/components/ui/page';
import { useMaker } from '@/features/showcase/api/get-maker';
import { MakerProfileView } from '@/features/showcase/components/maker-profile-view';
import { PublicShell } from '@/features/showcase/components/public-shell';

/** /m/:makerId — a maker's public projects, open to everyone. */
export default function MakerProfileRoute() {
  const { makerId = '' } = useParams();
  const maker = useMaker(makerId);
  return (
    <PublicShell>
      {maker.isPending ? (
        <div className="mx-auto max-w-3xl px-4">
          <Loading label="Opening the maker’s page…" />
        </div>
      ) : maker.error ? (
        <div className="mx-auto max-w-xl px-4 py-10">
          <EmptyState title={maker.error instanceof ApiError && maker.error.status === 404 ? 'Nothing shared here' : 'The page did not load'}>
            {maker.error instanceof ApiError && maker.error.status === 404 ? 'This maker has no public projects right now.' : maker.error.message}
          </EmptyState>
        </div>
      ) : (
        <MakerProfileView profile={maker.data} />
      )}
    </PublicShell>
  );
}
