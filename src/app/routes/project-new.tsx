import { useNavigate, useSearchParams } from 'react-router-dom';
import { BookOpen } from 'lucide-react';
import { Banner } from '@/components/ui/banner';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { SelectField } from '@/components/ui/field';
import { Loading, PageHeader } from '@/components/ui/page';
import { paths } from '@/config/paths';
import { IdParam } from '@/schemas/common';
import { usePattern } from '@/features/patterns/api/get-pattern';
import { usePatterns } from '@/features/patterns/api/get-patterns';
import { NewProjectForm } from '@/features/projects/components/new-project-form';

function PatternPicker({ onPick }: { onPick: (id: number) => void }) {
  const patterns = usePatterns();
  if (!patterns.data?.length) return null;
  return (
    <Card className="mb-6 p-4">
      <SelectField
        label={
          <span className="inline-flex items-center gap-2">
            <BookOpen aria-hidden className="h-5 w-5 text-moss" /> Start from one of your patterns
          </span>
        }
        hint="Or type the pieces in yourself below."
        defaultValue=""
        onChange={(e) => e.target.value && onPick(Number(e.target.value))}
      >
        <option value="">Choose a pattern…</option>
        {patterns.data.map((p) => (
          <option key={p.id} value={p.id}>
            {p.title}
          </option>
        ))}
      </SelectField>
    </Card>
  );
}

function FromPattern({ patternId }: { patternId: number }) {
  const navigate = useNavigate();
  const pattern = usePattern(patternId);
  if (pattern.isPending) return <Loading label="Reading the pattern…" />;
  if (pattern.isError)
    return (
      <div className="flex flex-col gap-4">
        <Banner tone="warning" title="That pattern could not be opened">
          It may be private to someone else, or deleted. You can still start from scratch.
        </Banner>
        <ButtonLink to={paths.newProject} variant="secondary">
          Start from scratch
        </ButtonLink>
      </div>
    );
  return <NewProjectForm key={pattern.data.id} pattern={pattern.data} onCreated={(p) => navigate(paths.project(p.id))} />;
}

/** /projects/new — from a pattern (?patternId=) or from scratch. */
export default function NewProjectRoute() {
  const navigate = useNavigate();
  const [search, setSearch] = useSearchParams();
  const parsed = IdParam.safeParse(search.get('patternId') ?? undefined);
  const patternId = parsed.success ? parsed.data : undefined;
  return (
    <div className="mx-auto max-w-2xl">
      <PageHeader title="New project" subtitle={patternId ? 'Starting from a pattern: check the details, then start.' : 'From one of your patterns, or from scratch.'} />
      {patternId ? (
        <FromPattern patternId={patternId} />
      ) : (
        <>
          <PatternPicker onPick={(id) => setSearch({ patternId: String(id) })} />
          <NewProjectForm onCreated={(p) => navigate(paths.project(p.id))} />
        </>
      )}
    </div>
  );
}
