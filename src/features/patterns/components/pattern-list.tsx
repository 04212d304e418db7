import { Link } from 'react-router-dom';
import { AlertTriangle, CheckCircle2, ChevronRight, Globe, Lock, Users } from 'lucide-react';
import { paths } from '@/config/paths';
import { patternVisibilityLabels } from '@/schemas/pattern';
import type { PatternListItem } from '@/types/api';
import { Card } from '@/components/ui/card';

const visibilityIcon = {
  private: <Lock aria-hidden className="h-4 w-4" />,
  testers: <Users aria-hidden className="h-4 w-4" />,
  public: <Globe aria-hidden className="h-4 w-4" />,
};

const when = (iso: string) =>
  new Date(iso).toLocaleDateString(undefined, { day: 'numeric', month: 'short', year: 'numeric' });

export function PatternList({ patterns }: { patterns: PatternListItem[] }) {
  return (
    <ul className="grid gap-4 sm:grid-cols-2">
      {patterns.map((p) => (
        <li key={p.id}>
          <Link to={paths.pattern(p.id)} className="block rounded-blob focus-visible:outline-clay">
            <Card className="flex items-center gap-4 transition hover:ring-moss">
              <div className="flex min-w-0 flex-1 flex-col gap-1">
                <p className="truncate text-lg font-bold">{p.title}</p>
                {p.designerCredit ? (
                  <p className="truncate text-sm text-ink/70 dark:text-oat/70">by {p.designerCredit}</p>
                ) : null}
                <p className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
                  <span>
                    <span className="tabular">{p.pieceCount}</span> {p.pieceCount === 1 ? 'piece' : 'pieces'}
                  </span>
                  {p.problemCount ? (
                    <span className="inline-flex items-center gap-1 font-semibold text-clay">
                      <AlertTriangle aria-hidden className="h-4 w-4" />{' '}
                      <span className="tabular">{p.problemCount}</span> to check
                    </span>
                  ) : (
                    <span className="inline-flex items-center gap-1 text-moss dark:text-[#9cc3a8]">
                      <CheckCircle2 aria-hidden className="h-4 w-4" /> counts add up
                    </span>
                  )}
                  <span className="inline-flex items-center gap-1">
                    {visibilityIcon[p.visibility]} {patternVisibilityLabels[p.visibility]}
                  </span>
                  <span className="text-ink/70 dark:text-oat/70">changed {when(p.updatedAt)}</span>
                </p>
              </div>
              <ChevronRight aria-hidden className="h-6 w-6 shrink-0 text-moss" />
            </Card>
          </Link>
        </li>
      ))}
    </ul>
  );
}
