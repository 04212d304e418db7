import { useEffect } from 'react';
import { Link } from 'react-router-dom';
import { PartyPopper, Image as ImageIcon } from 'lucide-react';
import type { MakerProfile } from '@/types/showcase';
import { formatDay, plural } from '../format';

/** A maker's public page: only the projects they chose to make public; link-only pages never appear here. */
export function MakerProfileView({ profile }: { profile: MakerProfile }) {
  const name = profile.maker.displayName;
  useEffect(() => {
    document.title = `${name}’s makes · Whorlbook`;
  }, [name]);
  return (
    <div className="mx-auto max-w-3xl px-4 pb-16 pt-2">
      <h1 className="text-3xl font-bold leading-tight">{name}’s makes</h1>
      <p className="mt-1 text-ink/70 dark:text-oat/70">{plural(profile.projects.length, 'piece')} shared on Whorlbook</p>
      <ul className="mt-6 grid gap-4 sm:grid-cols-2">
        {profile.projects.map((p) => (
          <li key={p.url}>
            <Link to={p.url} className="block rounded-blob focus-visible:outline-clay">
              <div className="overflow-hidden rounded-blob bg-white/80 shadow-sm ring-1 ring-wool transition hover:ring-moss dark:bg-[#332e2a] dark:ring-[#4a423c]">
                {p.cover ? (
                  <img src={p.cover.url} alt={p.cover.alt} className="aspect-[4/3] w-full object-cover" loading="lazy" />
                ) : (
                  <div className="flex aspect-[4/3] w-full items-center justify-center bg-wool text-ink/50 dark:bg-[#3a3430] dark:text-oat/50">
                    <ImageIcon aria-hidden className="h-10 w-10" />
                    <span className="sr-only">No photo yet</span>
                  </div>
                )}
                <div className="p-4">
                  <p className="text-lg font-bold">{p.title}</p>
                  <p className="flex flex-wrap items-center gap-x-2 text-sm text-ink/70 dark:text-oat/70">
                    <span>{p.finishedOn ? `Finished ${formatDay(p.finishedOn)}` : p.statusLabel}</span>
                    <span aria-hidden>·</span>
                    <span className="inline-flex items-center gap-1 tabular">
                      <PartyPopper aria-hidden className="h-4 w-4" /> {plural(p.cheerCount, 'cheer')}
                    </span>
                  </p>
                </div>
              </div>
            </Link>
          </li>
        ))}
      </ul>
    </div>
  );
}
