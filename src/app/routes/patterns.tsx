import { Plus } from 'lucide-react';
import { paths } from '@/config/paths';
import { usePatterns } from '@/features/patterns/api/get-patterns';
import { PatternList } from '@/features/patterns/components/pattern-list';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState, Loading, PageHeader } from '@/components/ui/page';

export default function PatternsRoute() {
  const patterns = usePatterns();
  return (
    <>
      <PageHeader
        title="Patterns"
        subtitle="Patterns you follow or write, with every round's count checked."
        action={
          <ButtonLink to={paths.newPattern}>
            <Plus aria-hidden className="h-5 w-5" /> New pattern
          </ButtonLink>
        }
      />
      {patterns.isPending ? (
        <Loading label="Finding your patterns…" />
      ) : patterns.data?.length ? (
        <PatternList patterns={patterns.data} />
      ) : patterns.isError ? (
        <EmptyState title="Your patterns could not be loaded">{patterns.error.message}</EmptyState>
      ) : (
        <EmptyState
          title="No patterns yet"
          action={<ButtonLink to={paths.newPattern}>Type in a pattern</ButtonLink>}
        >
          Type or paste the pattern you are following, and the round table checks every count as you go.
        </EmptyState>
      )}
    </>
  );
}
