import { Banner } from '@/components/ui/banner';
import type { Caution } from '@/types/api';

/** Toy-safety cautions (product brief "Safety"): one caution banner each, with its reason in words. */
export function Cautions({ cautions, className }: { cautions: Caution[]; className?: string }) {
  if (!cautions.length) return null;
  return (
    <section aria-label="Safety" className={className}>
      <div className="flex flex-col gap-3">
        {cautions.map((c) => (
          <Banner key={c.code} tone="caution" title={c.title}>
            {c.message}
          </Banner>
        ))}
      </div>
    </section>
  );
}
