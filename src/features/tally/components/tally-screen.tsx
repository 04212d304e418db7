import {
  memo,
  useCallback,
  useDeferredValue,
  useEffect,
  useMemo,
  useRef,
  useState,
  type ReactNode,
} from 'react';
import { Link } from 'react-router-dom';
import {
  ArrowLeft,
  CheckCheck,
  Cloud,
  CloudOff,
  ListOrdered,
  MapPin,
  MapPinPlus,
  Plus,
  Settings2,
  Undo2,
} from 'lucide-react';
import type { Terms } from '@/engine/types';
import type { StitchSize } from '@/components/silhouette/geometry';
import { Loading } from '@/components/ui/page';
import { cn } from '@/utils/cn';
import { usePlacements } from '../api/get-placements';
import { useDeletePlacement } from '../api/delete-placement';
import { useTally, type TallyPiece } from '../hooks/use-tally';
import { useOutbox } from '../hooks/use-outbox';
import { useWakeLock } from '../hooks/use-wake-lock';
import { useWide } from '../hooks/use-wide';
import { useProgressStream } from '../hooks/use-progress-stream';
import { buzz, click } from '../lib/feedback';
import { outbox, queuedMarks } from '../lib/outbox';
import { newOpId } from '../lib/op-id';
import { useTallySettings } from '../lib/settings';
import { ZoneContent } from './zone-content';
import { SyncBanner, useWaiting } from './sync-banner';
import { JumpSheet } from './jump-sheet';
import { MarkSheet } from './mark-sheet';
import { MarksSheet, PieceMarks, placementWhere, type ShownPlacement } from './marks-sheet';
import { SettingsSheet } from './settings-sheet';
import { TimeLine } from './time-line';

export interface TallyScreenProps {
  piece: TallyPiece;
  /** The signed-in member: their taps are queued under their id. */
  memberId: string;
  terms: Terms;
  projectTitle: string;
  backTo: string;
  /** Steps still to count on the project's other pieces, for the project estimate (null when unknown). */
  otherPiecesRemaining: number | null;
  /** Safety cautions of the project, shown with placement notes. */
  cautions: string[];
  stitchSize: StitchSize;
  /** The piece was edited elsewhere (its count moved with no tap): read it again. */
  onPieceChanged?: () => void;
}

type Sheet = 'jump' | 'mark' | 'marks' | 'settings' | null;

const STEP_KEYS = new Set([' ', 'Spacebar', 'Enter', 'ArrowRight', 'ArrowDown', 'PageDown']);
const UNDO_KEYS = new Set(['Backspace', 'ArrowLeft', 'ArrowUp', 'PageUp']);
const DEFAULT_LABELS = ['left eye', 'right eye', 'nose', 'mouth', 'arm', 'leg', 'ear'];

function ToolButton({
  onClick,
  icon,
  children,
  label,
  disabled,
  tone = 'plain',
}: {
  onClick: () => void;
  icon: ReactNode;
  children: ReactNode;
  label?: string;
  disabled?: boolean;
  tone?: 'plain' | 'strong';
}) {
  return (
    <button
      type="button"
      onClick={onClick}
      disabled={disabled}
      aria-label={label}
      className={cn(
        'flex min-h-16 flex-1 flex-col items-center justify-center gap-0.5 rounded-soft px-1 text-sm font-bold select-none disabled:opacity-40 sm:flex-row sm:gap-2 sm:text-base',
        tone === 'strong'
          ? 'bg-ink text-oat dark:bg-oat dark:text-ink'
          : 'bg-wool text-ink hover:bg-[#d9ccb4] dark:bg-[#3a3430] dark:text-oat dark:hover:bg-[#4a423c]',
      )}
    >
      {icon}
      <span>{children}</span>
    </button>
  );
}

// The header and the tool bar are memoised on props that a tap does not change (the handlers are stable, see
// `act` below), so a tap renders only what it changes: the zone, the time line and the spoken position.

const TallyHeader = memo(function TallyHeader({
  backTo,
  projectTitle,
  pieceName,
  copy,
  copies,
  waiting,
  live,
  marks,
  openSheet,
}: {
  backTo: string;
  projectTitle: string;
  pieceName: string;
  copy: number;
  copies: number;
  /** Taps worth mentioning as waiting; 0 shows "Saved". */
  waiting: number;
  live: boolean;
  marks: number;
  openSheet: (sheet: Sheet) => void;
}) {
  const synced = waiting === 0;
  return (
    <header className="flex items-center gap-1 px-2 pt-[max(0.25rem,env(safe-area-inset-top))]">
      <Link
        to={backTo}
        className="flex min-h-14 min-w-14 items-center justify-center rounded-soft hover:bg-wool dark:hover:bg-white/10"
        aria-label={`Back to ${projectTitle}`}
      >
        <ArrowLeft aria-hidden className="h-7 w-7" />
      </Link>
      <div className="min-w-0 flex-1">
        <h1 className="truncate text-xl font-bold leading-tight sm:text-2xl">
          {pieceName}
          {copies > 1 ? (
            <span className="tabular">
              {' '}
              {copy} of {copies}
            </span>
          ) : null}
        </h1>
        <p className="truncate text-sm opacity-75">{projectTitle}</p>
      </div>
      <span
        className={cn(
          'flex min-h-14 items-center gap-1 rounded-soft px-2 text-sm font-bold',
          synced ? 'opacity-75' : 'text-clay dark:text-[#e8a283]',
        )}
        title={live ? 'Live with your other devices' : 'Checking for changes every few seconds'}
      >
        {synced ? <Cloud aria-hidden className="h-5 w-5" /> : <CloudOff aria-hidden className="h-5 w-5" />}
        <span className="tabular">{synced ? 'Saved' : `${waiting} waiting`}</span>
      </span>
      <button
        type="button"
        onClick={() => openSheet('marks')}
        className="relative flex min-h-14 min-w-14 items-center justify-center rounded-soft hover:bg-wool dark:hover:bg-white/10"
        aria-label={`Marks and silhouette (${marks})`}
      >
        <MapPin aria-hidden className="h-7 w-7" />
        {marks ? (
          <span className="tabular absolute top-1 right-1 rounded-full bg-clay px-1.5 text-xs font-bold text-oat">
            {marks}
          </span>
        ) : null}
      </button>
      <button
        type="button"
        onClick={() => openSheet('settings')}
        className="flex min-h-14 min-w-14 items-center justify-center rounded-soft hover:bg-wool dark:hover:bg-white/10"
        aria-label="Tally settings"
      >
        <Settings2 aria-hidden className="h-7 w-7" />
      </button>
    </header>
  );
});

const TallyTools = memo(function TallyTools({
  mode,
  canUndo,
  countingDone,
  onUndo,
  onOther,
  openSheet,
}: {
  mode: 'stitch' | 'round';
  canUndo: boolean;
  /** The piece is counted to the end and no note waits: nothing left to count. */
  countingDone: boolean;
  onUndo: () => void;
  /** "One stitch" in round mode, "Round done" in stitch mode. */
  onOther: () => void;
  openSheet: (sheet: Sheet) => void;
}) {
  return (
    <nav aria-label="Tally" className="flex gap-2 px-3 pt-2 pb-[max(0.75rem,env(safe-area-inset-bottom))]">
      <ToolButton
        tone="strong"
        onClick={onUndo}
        disabled={!canUndo}
        icon={<Undo2 aria-hidden className="h-6 w-6" />}
      >
        Undo
      </ToolButton>
      {mode === 'round' ? (
        <ToolButton onClick={onOther} disabled={countingDone} icon={<Plus aria-hidden className="h-6 w-6" />}>
          One stitch
        </ToolButton>
      ) : (
        <ToolButton
          onClick={onOther}
          disabled={countingDone}
          icon={<CheckCheck aria-hidden className="h-6 w-6" />}
        >
          Round done
        </ToolButton>
      )}
      <ToolButton onClick={() => openSheet('mark')} icon={<MapPinPlus aria-hidden className="h-6 w-6" />}>
        Mark here
      </ToolButton>
      <ToolButton onClick={() => openSheet('jump')} icon={<ListOrdered aria-hidden className="h-6 w-6" />}>
        Jump
      </ToolButton>
    </nav>
  );
});

/** The Tally: one piece, counted stitch by stitch (or round by round) with one huge tap zone. */
export function TallyScreen({
  piece,
  memberId,
  terms,
  projectTitle,
  backTo,
  otherPiecesRemaining,
  cautions,
  stitchSize,
  onPieceChanged,
}: TallyScreenProps) {
  const tally = useTally(piece, terms, memberId);
  const [settings, setSettings] = useTallySettings();
  const box = useOutbox();
  const stream = useProgressStream(piece.id, onPieceChanged);
  const wake = useWakeLock(settings.keepAwake);
  const placementsQuery = usePlacements(piece.id);
  const deletePlacement = useDeletePlacement(piece.id);
  const [sheet, setSheet] = useState<Sheet>(null);
  const zone = useRef<HTMLButtonElement>(null);
  const hc = settings.highContrast;
  const { view, position } = tally;

  const feedback = useCallback(
    (kind: 'step' | 'round' | 'note' | 'undo' | 'end') => {
      if (kind === 'end') return;
      if (settings.vibrate) buzz(kind);
      if (settings.sound && kind !== 'note') click(kind);
    },
    [settings.vibrate, settings.sound],
  );

  // The latest handlers, read through stable functions: the memoised header and tool bar never re-render just
  // because a tap made new closures.
  const act = useRef({ countTap: () => {}, undo: () => {}, other: () => {} });
  act.current = {
    countTap: () => feedback(settings.mode === 'round' ? tally.round() : tally.step()),
    undo: () => {
      if (tally.undo()) feedback('undo');
    },
    other: () => feedback(settings.mode === 'round' ? tally.step() : tally.round()),
  };
  const countTap = useCallback(() => act.current.countTap(), []);
  // After any control, the next pedal press or Enter should count again, not repeat that control.
  const backToZone = useCallback(() => zone.current?.focus({ preventScroll: true }), []);
  const onUndo = useCallback(() => {
    act.current.undo();
    backToZone();
  }, [backToZone]);
  const onOther = useCallback(() => {
    act.current.other();
    backToZone();
  }, [backToZone]);

  // Hands-free: a keyboard or a Bluetooth page-turner pedal.
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.ctrlKey || e.metaKey || e.altKey || e.defaultPrevented) return;
      const t = e.target as HTMLElement | null;
      if (t && (t.closest('input, textarea, select, [contenteditable="true"]') || t.closest('dialog[open]')))
        return;
      if (document.querySelector('dialog[open]')) return;
      const isStep = STEP_KEYS.has(e.key);
      const isUndo = UNDO_KEYS.has(e.key);
      if (!isStep && !isUndo) return;
      // Enter or Space on another button presses that button, as a keyboard user expects.
      if ((e.key === 'Enter' || e.key === ' ') && t && t !== zone.current && t.closest('button, a')) return;
      e.preventDefault();
      if (e.repeat) return; // a held key or a bouncing pedal is one tap
      if (isStep) act.current.countTap();
      else act.current.undo();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, []);

  // Only marks waiting in the outbox matter here, not every queued tap: keep the list (and the silhouette) still.
  const marks = queuedMarks(box.items, piece.id);
  const wide = useWide();
  const waiting = useWaiting(box, memberId);
  const placements: ShownPlacement[] = useMemo(() => {
    const saved = (placementsQuery.data ?? []).map((p) => ({ ...p, waiting: false, key: `s${p.id}` }));
    const queued = marks.flatMap((i) =>
      i.kind === 'placement' && i.pieceId === piece.id
        ? [
            {
              id: null,
              pieceId: piece.id,
              copy: i.input.copy ?? 1,
              round: i.input.round,
              step: i.input.step ?? null,
              label: i.input.label,
              note: i.input.note ?? null,
              waiting: true,
              key: `q${i.opId}`,
            },
          ]
        : [],
    );
    return [...saved, ...queued];
  }, [placementsQuery.data, marks, piece.id]);

  const whereNow =
    view && position
      ? placementWhere(
          { round: view.round.number, step: view.stepsDone, copy: position.copy },
          piece.copies,
          view.word,
        )
      : '';
  const saveMark = (v: { label: string; note: string }) => {
    if (!view || !position) return;
    outbox.enqueue(
      {
        kind: 'placement',
        pieceId: piece.id,
        input: {
          opId: newOpId(),
          round: view.round.number,
          step: view.stepsDone,
          copy: position.copy,
          label: v.label,
          ...(v.note ? { note: v.note } : {}),
        },
      },
      memberId,
    );
  };
  const suggestions = useMemo(() => {
    const fromNotes = tally.check.notes.flatMap((n) =>
      n.kind === 'placement' && n.placement?.label ? [n.placement.label] : [],
    );
    const fromOthers = placements.filter((p) => p.round === view?.round.number).map((p) => p.label);
    return [...new Set([...fromOthers, ...fromNotes, ...DEFAULT_LABELS])].slice(0, 8);
  }, [tally.check.notes, placements, view?.round.number]);
  // Where the same part went on another copy at this round: the second ear goes where the first did.
  const roundNumber = view?.round.number;
  const copyNow = position?.copy;
  const earlier = useMemo(
    () =>
      roundNumber === undefined
        ? []
        : placements.filter((p) => p.round === roundNumber && p.copy !== copyNow),
    [placements, roundNumber, copyNow],
  );

  const announcement = useMemo(() => {
    if (!view || !position) return '';
    const copy = piece.copies > 1 ? `${piece.name} ${position.copy} of ${piece.copies}. ` : '';
    if (tally.unread.length) return `${copy}Note: ${tally.unread[0].note.text}`;
    if (tally.finished) return `${copy}${piece.name} is counted to the end.`;
    return `${copy}${view.name} of ${view.of}, stitch ${view.stepsDone} of ${view.stepsInRound}. ${view.next ? `Next: ${view.next.text}.` : ''}`;
  }, [view, position, piece, tally.unread, tally.finished]);
  // What only needs to follow the count (the spoken position, working time and time left) is drawn in React's
  // deferred pass, after the tap's own render: the tap's frame carries only the zone.
  const spoken = useDeferredValue(announcement);
  const doneLater = useDeferredValue(tally.done);
  const remainingLater = useDeferredValue(tally.remainingSteps);

  const rootTone = hc
    ? 'bg-white text-black dark:bg-black dark:text-white'
    : 'bg-oat text-ink dark:bg-ink dark:text-oat';
  const zoneTone = hc
    ? 'bg-white text-black border-4 border-black dark:bg-black dark:text-white dark:border-white'
    : 'bg-[#fdfbf7] text-ink border-2 border-wool dark:bg-[#332e2a] dark:text-oat dark:border-[#4a423c]';

  if (!position || !view || !box.loaded) {
    return (
      <div
        className={cn('flex min-h-dvh flex-col items-center justify-center gap-4 p-6 text-center', rootTone)}
      >
        {tally.progress.isError && !tally.progress.data ? (
          <>
            <p className="text-xl font-bold">The Tally cannot open this piece right now.</p>
            <p>
              {navigator.onLine === false
                ? 'You are offline, and this piece was not opened on this device before. Open it once while online and it will work offline after.'
                : tally.progress.error.message}
            </p>
            <Link to={backTo} className="min-h-tap rounded-soft bg-moss px-5 py-3 font-bold text-oat">
              Back to {projectTitle}
            </Link>
          </>
        ) : tally.check.rounds.length === 0 && tally.progress.data ? (
          <>
            <p className="text-xl font-bold">{piece.name} has no rounds to count yet.</p>
            <p>
              Add its instructions on the project page (for example “Rnd 1: 6 sc in MR (6)”), then come back.
            </p>
            <Link to={backTo} className="min-h-tap rounded-soft bg-moss px-5 py-3 font-bold text-oat">
              Back to {projectTitle}
            </Link>
          </>
        ) : (
          <Loading label="Opening the Tally…" />
        )}
      </div>
    );
  }

  const unread = tally.unread[0];
  const zoneLabel = unread
    ? `Done: ${unread.note.text}`
    : tally.finished
      ? `${piece.name} is counted to the end`
      : settings.mode === 'round'
        ? `Round done: finish ${view.name}`
        : 'Count one stitch';
  const synced = !waiting.show;

  return (
    <div
      className={cn('flex h-dvh flex-col overflow-hidden', rootTone)}
      data-theme-contrast={hc ? 'high' : 'normal'}
    >
      <TallyHeader
        backTo={backTo}
        projectTitle={projectTitle}
        pieceName={piece.name}
        copy={position.copy}
        copies={piece.copies}
        waiting={synced ? 0 : waiting.count}
        live={stream === 'live'}
        marks={placements.length}
        openSheet={setSheet}
      />

      <div className="flex flex-col gap-2 px-3 empty:hidden">
        <SyncBanner state={box} memberId={memberId} pieceId={piece.id} />
        {wake === 'unsupported' || wake === 'refused' ? (
          <p className="rounded-soft bg-wool/70 px-4 py-1.5 text-sm text-ink">
            <span className="font-bold">Screen may sleep:</span>{' '}
            {wake === 'unsupported'
              ? 'this browser cannot keep it awake.'
              : 'the browser refused to keep it awake.'}{' '}
            Set a longer screen timeout in your device settings while you count.
          </p>
        ) : null}
      </div>

      <div className="flex min-h-0 flex-1 gap-3 px-3 py-2">
        <button
          ref={zone}
          type="button"
          aria-label={zoneLabel}
          aria-describedby="tally-position"
          onPointerDown={(e) => {
            if (e.button !== 0 || !e.isPrimary) return;
            // Counting on pointerdown paints in the same frame; the browser's later click is ignored below.
            e.preventDefault();
            zone.current?.focus({ preventScroll: true });
            countTap();
          }}
          onClick={(e) => {
            // Screen readers and switch access send a click with no pointer press before it.
            if (e.detail === 0) countTap();
          }}
          onContextMenu={(e) => e.preventDefault()}
          className={cn(
            // Opaque, bordered and contained: a tap repaints only the zone, and cheaply.
            'flex min-h-0 flex-1 touch-manipulation flex-col rounded-blob px-4 py-3 text-left select-none [contain:strict] focus-visible:outline-offset-4 md:px-8 md:py-6',
            zoneTone,
          )}
          data-testid="tally-zone"
        >
          <ZoneContent
            view={view}
            unread={unread ?? null}
            moreNotes={tally.unread.length - 1}
            finished={tally.finished}
            mode={settings.mode}
            highContrast={hc}
            earlier={earlier}
            cautions={cautions}
            pieceName={piece.name}
            copies={piece.copies}
            rounds={tally.check.rounds.length}
          />
        </button>
        {/* On a tablet there is room to keep the silhouette in view beside the tap zone. */}
        {wide ? (
          <aside aria-label={`Marks on ${piece.name}`} className="w-72 shrink-0 overflow-y-auto lg:w-80">
            <PieceMarks
              check={tally.check}
              size={stitchSize}
              placements={placements}
              copies={piece.copies}
              pieceName={piece.name}
              current={view.round.number}
              compact
            />
          </aside>
        ) : null}
      </div>
      <p id="tally-position" className="sr-only" aria-live="polite" aria-atomic="true">
        {spoken}
      </p>

      <div className="px-3">
        <TimeLine
          clock={tally.clock}
          remainingPiece={remainingLater}
          remainingProject={otherPiecesRemaining === null ? null : otherPiecesRemaining + remainingLater}
          done={doneLater}
        />
      </div>
      <TallyTools
        mode={settings.mode}
        canUndo={tally.canUndo}
        countingDone={tally.finished && !unread}
        onUndo={onUndo}
        onOther={onOther}
        openSheet={setSheet}
      />

      {sheet === 'jump' ? (
        <JumpSheet
          open
          onClose={() => setSheet(null)}
          check={tally.check}
          copies={piece.copies}
          pieceName={piece.name}
          position={position}
          onJump={(to) => {
            tally.jump(to);
            backToZone();
          }}
        />
      ) : null}
      {sheet === 'mark' ? (
        <MarkSheet
          open
          onClose={() => setSheet(null)}
          where={whereNow}
          suggestions={suggestions}
          onSave={saveMark}
        />
      ) : null}
      {sheet === 'marks' ? (
        <MarksSheet
          open
          onClose={() => setSheet(null)}
          check={tally.check}
          size={stitchSize}
          placements={placements}
          copies={piece.copies}
          pieceName={piece.name}
          current={view.round.number}
          onDelete={(id) => deletePlacement.mutate(id)}
        />
      ) : null}
      {sheet === 'settings' ? (
        <SettingsSheet open onClose={() => setSheet(null)} settings={settings} onChange={setSettings} />
      ) : null}
    </div>
  );
}
