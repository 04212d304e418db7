import { Link, useSearchParams } from 'react-router-dom';
import { BookOpen, ChevronRight, Gift, Library, Plus, Ruler, ShieldAlert, type LucideIcon } from 'lucide-react';
import type { ReactNode } from 'react';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState, Loading, PageHeader } from '@/components/ui/page';
import { paths } from '@/config/paths';
import { projectStatusLabels, ProjectStatusSchema } from '@/schemas/common';
import { useProjects } from '@/features/projects/api/get-projects';
import { StatusBadge } from '@/features/projects/components/status';
import { StatusFilter } from '@/features/projects/components/status-filter';

/** Every project of the member, filtered by status (kept in the address so back and reload keep it). */
export default function ProjectsRoute() {
  const [search, setSearch] = useSearchParams();
  const parsed = ProjectStatusSchema.safeParse(search.get('status'));
  const status = parsed.success ? parsed.data : undefined;
  const projects = useProjects(status ? { status } : {});

  return (
    <>
      <PageHeader
        title="Projects"
        subtitle="Everything you are making, have made, or mean to make."
        action={
          <ButtonLink to={paths.newProject}>
            <Plus aria-hidden className="h-5 w-5" /> New project
          </ButtonLink>
        }
      />
      <div className="mb-4 flex flex-col gap-3">
        <StatusFilter value={status} onChange={(s) => setSearch(s ? { status: s } : {}, { replace: true })} />
      </div>
      {projects.isPending ? (
        <Loading label="Finding your projects…" />
      ) : projects.data?.length ? (
        <ul className="grid gap-3 sm:grid-cols-2">
          {projects.data.map((p) => (
            <li key={p.id}>
              <Link to={paths.project(p.id)} className="block rounded-blob focus-visible:outline-clay">
                <Card className="flex items-center gap-3 p-4 transition hover:ring-moss">
                  <div className="flex min-w-0 flex-1 flex-col gap-1.5">
                    <p className="text-lg font-bold leading-snug">{p.title}</p>
                    <div className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm text-ink/75 dark:text-oat/75">
                      <StatusBadge status={p.status} />
                      <span className="tabular">
                        {p.pieceCount} {p.pieceCount === 1 ? 'piece' : 'pieces'}
                      </span>
                      {p.cautionCount ? (
                        <span className="inline-flex items-center gap-1 font-semibold text-clay dark:text-[#e59b7c]">
                          <ShieldAlert aria-hidden className="h-4 w-4" /> Safety note
                        </span>
                      ) : null}
                    </div>
                    {p.patternTitle || p.recipient ? (
                      <p className="flex flex-wrap gap-x-3 text-sm text-ink/75 dark:text-oat/75">
                        {p.patternTitle ? (
                          <span className="inline-flex min-w-0 items-center gap-1">
                            <BookOpen aria-hidden className="h-4 w-4 shrink-0" /> <span className="truncate">{p.patternTitle}</span>
                          </span>
                        ) : null}
                        {p.recipient ? (
                          <span className="inline-flex items-center gap-1">
                            <Gift aria-hidden className="h-4 w-4" /> for {p.recipient}
                          </span>
                        ) : null}
                      </p>
                    ) : null}
                  </div>
                  <ChevronRight aria-hidden className="h-6 w-6 shrink-0 text-moss dark:text-[#9cc3a8]" />
                </Card>
              </Link>
            </li>
          ))}
        </ul>
      ) : status ? (
        <EmptyState title={`No ${projectStatusLabels[status].toLowerCase()} projects`}>Choose another status above, or “All”.</EmptyState>
      ) : (
        <EmptyState title="No projects yet" action={<ButtonLink to={paths.newProject}>Start a project</ButtonLink>}>
          Start one from a pattern, or from scratch.
        </EmptyState>
      )}
      <ShelfLink to={paths.yarnShelf} icon={Library} title="Yarn shelf" className="mt-8">
        Your yarns and how much is left
      </ShelfLink>
      <ShelfLink to={paths.hookRoll} icon={Ruler} title="Hook roll" className="mt-3">
        Your hooks, smallest first
      </ShelfLink>
    </>
  );
}

/** A way from the project list to one of the maker's own supplies (the yarn shelf, the hook roll). */
function ShelfLink({ to, icon: Icon, title, className, children }: { to: string; icon: LucideIcon; title: string; className: string; children: ReactNode }) {
  return (
    <Link
      to={to}
      className={`${className} flex min-h-tap items-center gap-3 rounded-soft bg-wool/60 px-4 py-3 font-semibold hover:bg-wool dark:bg-white/5 dark:hover:bg-white/10`}
    >
      <Icon aria-hidden className="h-5 w-5 text-moss dark:text-[#9cc3a8]" />
      <span className="flex-1">
        {title}
        <span className="block text-sm font-normal text-ink/70 dark:text-oat/70">{children}</span>
      </span>
      <ChevronRight aria-hidden className="h-5 w-5" />
    </Link>
  );
}
