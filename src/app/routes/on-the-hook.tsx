import { Link } from 'react-router-dom';
import { Plus, ChevronRight } from 'lucide-react';
import { PageHeader, Loading, EmptyState } from '@/components/ui/page';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { useMe } from '@/features/auth/api/get-me';
import { useProjects } from '@/features/projects/api/get-projects';
import { projectStatusLabels } from '@/schemas/common';
import { paths } from '@/config/paths';
import { ResumeLine } from '@/features/home/components/resume-line';

/** Home: what is being worked now, one tap from the Tally. */
export default function OnTheHookRoute() {
  const me = useMe();
  const onHook = useProjects({ status: 'on_the_hook' });
  const all = useProjects();
  const others = (all.data ?? []).filter((p) => p.status !== 'on_the_hook').slice(0, 5);
  return (
    <>
      <PageHeader
        title="On the hook"
        subtitle={me.data ? `Hello, ${me.data.displayName}. Here is what you are making now.` : undefined}
        action={
          <ButtonLink to={paths.newProject} variant="primary">
            <Plus aria-hidden className="h-5 w-5" /> New project
          </ButtonLink>
        }
      />
      {onHook.isPending ? (
        <Loading label="Finding your projects…" />
      ) : onHook.data?.length ? (
        <ul className="grid gap-4 sm:grid-cols-2">
          {onHook.data.map((p) => (
            <li key={p.id}>
              <Card className="flex flex-col gap-3">
                <Link to={paths.project(p.id)} className="-m-2 flex min-h-tap items-center gap-4 rounded-soft p-2 hover:bg-wool/40 focus-visible:outline-clay dark:hover:bg-white/5">
                  <div className="flex-1">
                    <p className="text-lg font-bold">{p.title}</p>
                    <p className="text-sm text-ink/70 dark:text-oat/70">
                      {projectStatusLabels[p.status]} · <span className="tabular">{p.pieceCount}</span> {p.pieceCount === 1 ? 'piece' : 'pieces'}
                      {p.startedOn ? ` · started ${p.startedOn}` : ''}
                    </p>
                  </div>
                  <ChevronRight aria-hidden className="h-6 w-6 text-moss" />
                </Link>
                {p.pieceCount ? <ResumeLine projectId={p.id} /> : null}
              </Card>
            </li>
          ))}
        </ul>
      ) : (
        <EmptyState title="Nothing on the hook yet" action={<ButtonLink to={paths.newProject}>Start a project</ButtonLink>}>
          Start a project from one of your patterns, or from scratch.
        </EmptyState>
      )}
      {others.length ? (
        <section className="mt-8">
          <h2 className="mb-3 text-xl font-bold">Other projects</h2>
          <ul className="flex flex-col gap-2">
            {others.map((p) => (
              <li key={p.id}>
                <Link to={paths.project(p.id)} className="flex min-h-tap items-center justify-between rounded-soft bg-wool/60 px-4 py-2 font-semibold dark:bg-white/5">
                  <span>{p.title}</span>
                  <span className="text-sm font-normal">{projectStatusLabels[p.status]}</span>
                </Link>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </>
  );
}
