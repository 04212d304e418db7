import type { ReactNode } from 'react';
import Markdown from 'react-markdown';
import { ExternalLink } from 'lucide-react';
import { Card } from '@/components/ui/card';
import type { Showcase } from '@/types/showcase';
import { formatDay, formatMinutes } from '../format';

export function Section({ title, children, id, className }: { title: string; children: ReactNode; id?: string; className?: string }) {
  return (
    <Card className={`print:break-inside-avoid print:bg-white print:p-0 print:shadow-none print:ring-0 ${className ?? ''}`}>
      <section aria-labelledby={id ? `${id}-title` : undefined} id={id}>
        <h2 id={id ? `${id}-title` : undefined} className="mb-3 text-xl font-bold print:mb-1 print:text-base">
          {title}
        </h2>
        {children}
      </section>
    </Card>
  );
}

/** The maker's own journal text: Markdown, but never raw HTML or images, and links marked as not ours. */
export function JournalText({ children }: { children: string }) {
  return (
    <div className="space-y-2 break-words leading-relaxed [&_a]:font-semibold [&_a]:text-moss [&_a]:underline [&_ol]:list-decimal [&_ol]:pl-6 [&_ul]:list-disc [&_ul]:pl-6 dark:[&_a]:text-[#9cc3a8]">
      <Markdown
        skipHtml
        disallowedElements={['img']}
        unwrapDisallowed
        components={{
          a: ({ href, children: text }) => (
            <a href={href} rel="noopener nofollow ugc" target="_blank">
              {text}
            </a>
          ),
        }}
      >
        {children}
      </Markdown>
    </div>
  );
}

export function PatternCredit({ pattern }: { pattern: NonNullable<Showcase['pattern']> }) {
  return (
    <Section title="The pattern" id="pattern">
      <p className="text-lg font-semibold">{pattern.title}</p>
      {pattern.designerCredit ? <p className="text-ink/80 dark:text-oat/80">Designed by {pattern.designerCredit}</p> : null}
      {pattern.sourceUrl ? (
        <p className="mt-2">
          <a
            href={pattern.sourceUrl}
            rel="noopener nofollow ugc"
            target="_blank"
            className="inline-flex min-h-tap items-center gap-2 break-all font-semibold text-moss underline dark:text-[#9cc3a8]"
          >
            <ExternalLink aria-hidden className="h-4 w-4 shrink-0 print:hidden" />
            <span className="print:hidden">Where to find the pattern</span>
            <span className="hidden print:inline">{pattern.sourceUrl}</span>
          </a>
        </p>
      ) : null}
    </Section>
  );
}

const notionText = (n: Showcase['materials']['notions'][number]) =>
  [n.label, n.sizeMm ? `${n.sizeMm} mm` : null, n.quantity ? `× ${n.quantity}` : null].filter(Boolean).join(', ').replace(', ×', ' ×') + (n.note ? ` — ${n.note}` : '');

export function Materials({ materials }: { materials: Showcase['materials'] }) {
  const { yarns, hooks, notions } = materials;
  if (!yarns.length && !hooks.length && !notions.length) return null;
  const sub = 'mb-1 mt-3 text-sm font-bold uppercase tracking-wide text-ink/70 first:mt-0 dark:text-oat/70';
  return (
    <Section title="Materials" id="materials">
      {yarns.length ? (
        <>
          <h3 className={sub}>Yarn</h3>
          <ul className="space-y-2">
            {yarns.map((y, i) => (
              <li key={i}>
                <span className="font-semibold">{y.name}</span>
                {y.colour ? <span> · {y.colour}</span> : null}
                {y.fibre ? <span> · {y.fibre}</span> : null}
                <span className="block text-sm text-ink/75 dark:text-oat/75">
                  {[y.weight ? `${y.weight.approximate ? '≈ ' : ''}${y.weight.label}` : null, y.amount ? `${y.amount} used` : null].filter(Boolean).join(' · ') || 'Weight not given'}
                </span>
              </li>
            ))}
          </ul>
          <p className="mt-2 text-xs text-ink/60 dark:text-oat/60">Weights: Craft Yarn Council&apos;s www.YarnStandards.com</p>
        </>
      ) : null}
      {hooks.length ? (
        <>
          <h3 className={sub}>Hooks</h3>
          <ul className="space-y-1">
            {hooks.map((h, i) => (
              <li key={i} className="tabular">
                <span className="font-semibold">{h.mm} mm</span>
                {h.us ? <span> (US {h.us})</span> : null}
                {h.note ? <span className="text-ink/75 dark:text-oat/75"> — {h.note}</span> : null}
              </li>
            ))}
          </ul>
        </>
      ) : null}
      {notions.length ? (
        <>
          <h3 className={sub}>Notions</h3>
          <ul className="space-y-1">
            {notions.map((n, i) => (
              <li key={i}>{notionText(n)}</li>
            ))}
          </ul>
        </>
      ) : null}
    </Section>
  );
}

export function Pieces({ pieces, placements }: { pieces: Showcase['pieces']; placements: Showcase['placements'] }) {
  if (!pieces.length) return null;
  return (
    <Section title="Pieces" id="pieces">
      <ul className="flex flex-wrap gap-2">
        {pieces.map((p, i) => (
          <li key={i} className="rounded-soft bg-wool px-3 py-1.5 font-semibold dark:bg-[#3a3430] print:bg-transparent print:p-0 print:pr-3">
            {p.name}
            {p.copies > 1 ? <span className="tabular font-normal"> × {p.copies}</span> : null}
          </li>
        ))}
      </ul>
      {placements.length ? (
        <>
          <h3 className="mb-1 mt-4 text-sm font-bold uppercase tracking-wide text-ink/70 dark:text-oat/70">Where the parts went</h3>
          <ul className="space-y-1.5">
            {placements.map((p, i) => (
              <li key={i} className="tabular">
                {p.text}
              </li>
            ))}
          </ul>
        </>
      ) : null}
    </Section>
  );
}

export function Changes({ changes }: { changes: Showcase['changes'] }) {
  if (!changes.length) return null;
  return (
    <Section title="Changes from the pattern" id="changes">
      <ul className="space-y-3">
        {changes.map((c) => (
          <li key={c.id} className="border-l-4 border-clay pl-3">
            <p className="text-sm font-semibold text-ink/70 dark:text-oat/70">{formatDay(c.date)}</p>
            <JournalText>{c.body}</JournalText>
          </li>
        ))}
      </ul>
    </Section>
  );
}

export function Journal({ entries }: { entries: Showcase['journal'] }) {
  if (!entries.length) return null;
  return (
    <Section title="From the journal" id="journal">
      <ol className="space-y-4">
        {entries.map((e) => (
          <li key={e.id}>
            <p className="text-sm font-semibold text-ink/70 dark:text-oat/70">
              {formatDay(e.date)}
              {e.minutes ? ` · ${formatMinutes(e.minutes)}` : ''}
            </p>
            <JournalText>{e.body}</JournalText>
          </li>
        ))}
      </ol>
    </Section>
  );
}

export function Facts({ showcase }: { showcase: Showcase }) {
  const time = formatMinutes(showcase.workingMinutes);
  const items: Array<[string, string]> = [['Status', showcase.statusLabel]];
  if (showcase.startedOn) items.push(['Started', formatDay(showcase.startedOn)]);
  if (showcase.finishedOn) items.push(['Finished', formatDay(showcase.finishedOn)]);
  if (time) items.push(['Working time', time]);
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4 print:flex print:flex-wrap print:gap-x-6 print:gap-y-1">
      {items.map(([k, v]) => (
        <div key={k} className="rounded-soft bg-white/70 px-3 py-2 ring-1 ring-wool dark:bg-[#332e2a] dark:ring-[#4a423c] print:bg-transparent print:p-0 print:ring-0">
          <dt className="text-xs font-bold uppercase tracking-wide text-ink/60 dark:text-oat/60">{k}</dt>
          <dd className="tabular font-semibold">{v}</dd>
        </div>
      ))}
    </dl>
  );
}
