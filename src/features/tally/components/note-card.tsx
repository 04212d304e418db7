import { Cloud, Info, Layers, Link2, MapPin, Palette, Ruler, Scissors } from 'lucide-react';
import type { NoteKind } from '@/engine/types';
import type { DueNote } from '../lib/piece-view';

const kinds: Record<NoteKind, { word: string; icon: typeof Info }> = {
  colour: { word: 'Colour change', icon: Palette },
  hook: { word: 'Hook change', icon: Ruler },
  stuffing: { word: 'Stuffing', icon: Cloud },
  placement: { word: 'Placement', icon: MapPin },
  'fasten-off': { word: 'Fasten off', icon: Scissors },
  join: { word: 'Join the round', icon: Link2 },
  other: { word: 'Note', icon: Info },
};

export function noteTitle(due: DueNote, roundName: string): string | null {
  if (due.reason === 'copy') return null;
  if (due.reason === 'end') return 'After the last round';
  if (due.reason === 'mark') return `Where it goes: at ${roundName}`;
  return `Before ${roundName}`;
}

/** A note shown large in the tap zone: the next tap confirms it instead of counting. */
export function NoteCard({
  due,
  roundName,
  more,
  cautions,
}: {
  due: DueNote;
  roundName: string;
  more: number;
  cautions: string[];
}) {
  const k = due.reason === 'copy' ? { word: 'New copy', icon: Layers } : kinds[due.note.kind];
  const Icon = k.icon;
  return (
    <span className="flex h-full flex-col items-center justify-center gap-4 px-2 text-center">
      <span className="flex items-center gap-2 rounded-full bg-clay px-4 py-1.5 text-base font-bold text-oat">
        <Icon aria-hidden className="h-5 w-5" />
        {k.word}
      </span>
      {noteTitle(due, roundName) ? (
        <span className="block text-lg font-semibold opacity-80">{noteTitle(due, roundName)}</span>
      ) : null}
      <span className="block text-3xl leading-tight font-bold sm:text-4xl md:text-5xl">{due.note.text}</span>
      {due.note.kind === 'hook' && due.note.hookMm ? (
        <span className="block text-2xl font-semibold">Hook: {due.note.hookMm} mm</span>
      ) : null}
      {cautions.map((c) => (
        <span
          key={c}
          className="block max-w-md rounded-soft bg-[#f3dccf] px-3 py-2 text-left text-sm leading-snug text-ink ring-2 ring-clay"
        >
          <span className="font-bold">Safety: </span>
          {c}
        </span>
      ))}
      <span className="mt-2 block rounded-soft border-2 border-current px-5 py-3 text-xl font-bold">
        Tap here when it’s done{more > 0 ? ` (${more} more note${more === 1 ? '' : 's'})` : ''}
      </span>
    </span>
  );
}
