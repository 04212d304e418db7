import { memo, useEffect, useState } from 'react';
import { Timer } from 'lucide-react';
import { formatDuration, type SessionClock } from '../lib/session-clock';

/** Working time this session, pace, and what is left: its own small clock, so the rest of the screen stays still. */
export const TimeLine = memo(function TimeLine({
  clock,
  remainingPiece,
  remainingProject,
}: {
  clock: SessionClock;
  remainingPiece: number;
  remainingProject: number | null;
  done: number;
}) {
  const [, setTick] = useState(0);
  useEffect(() => {
    const t = setInterval(() => setTick((n) => n + 1), 15_000);
    return () => clearInterval(t);
  }, []);
  // Rendered again after every tap (done changes; the Tally passes it deferred) and every 15 s: current enough.
  const now = Date.now();
  const r = clock.read(now);
  const pace = r.stepsPerMinute;
  const left = (steps: number) => (pace && pace > 0 ? formatDuration((steps / pace) * 60_000) : null);
  const pieceLeft = left(remainingPiece);
  const projectLeft = remainingProject !== null ? left(remainingProject) : null;
  return (
    <p className="flex flex-wrap items-center gap-x-3 gap-y-0.5 text-sm leading-snug sm:text-base">
      <Timer aria-hidden className="h-4 w-4 shrink-0" />
      <span className="tabular">
        {r.steps === 0 && r.activeMs === 0
          ? 'Timer starts with your first stitch'
          : `Working time: ${formatDuration(r.activeMs)}`}
        {r.paused ? ' · paused' : ''}
      </span>
      {r.stitchesPerMinute ? (
        <span className="tabular">{Math.round(r.stitchesPerMinute)} stitches a minute</span>
      ) : null}
      {pieceLeft ? <span className="tabular">about {pieceLeft} left on this piece</span> : null}
      {projectLeft && remainingProject !== remainingPiece ? (
        <span className="tabular">{projectLeft} for the project</span>
      ) : null}
    </p>
  );
});
