// Active working time: the time between taps counts while the gaps stay short; after a few quiet minutes the
// clock pauses (the maker put the work down) and starts again with the next tap.

export const IDLE_MS = 3 * 60_000;

export interface ClockReading {
  activeMs: number;
  paused: boolean;
  steps: number;
  stitches: number;
  /** Steps per active minute, once there is enough to go on. */
  stepsPerMinute: number | null;
  stitchesPerMinute: number | null;
}

const PACE_KEY = 'whorlbook.tally.pace';
// Enough counting for a pace worth quoting (a guess from a handful of taps swings wildly).
const MIN_STEPS = 12;
const MIN_MS = 60_000;

interface Pace {
  ms: number;
  steps: number;
}

function readPace(): Pace {
  try {
    const p = JSON.parse(localStorage.getItem(PACE_KEY) ?? 'null') as Pace | null;
    if (p && Number.isFinite(p.ms) && Number.isFinite(p.steps)) return p;
  } catch {
    /* no stored pace */
  }
  return { ms: 0, steps: 0 };
}

export class SessionClock {
  private activeMs = 0;
  private lastTap: number | null = null;
  private steps = 0;
  private stitches = 0;
  private counted: Array<{ steps: number; stitches: number }> = [];
  private pace = readPace();
  private savedAt = 0;

  /** A counting tap moved `steps` steps that made `stitches` stitches. */
  tap(now: number, steps: number, stitches: number) {
    const gap = this.lastTap === null ? 0 : now - this.lastTap;
    const active = gap > 0 && gap < IDLE_MS ? gap : 0;
    this.activeMs += active;
    this.lastTap = now;
    this.steps += steps;
    this.stitches += stitches;
    this.counted.push({ steps, stitches });
    this.remember(active, steps);
  }

  /** An undo takes back what the last tap added (but the time spent still counts). */
  undo(now: number) {
    const last = this.counted.pop();
    if (last) {
      this.steps -= last.steps;
      this.stitches -= last.stitches;
      this.remember(0, -last.steps);
    }
    if (this.lastTap !== null && now - this.lastTap < IDLE_MS) this.activeMs += now - this.lastTap;
    this.lastTap = now;
  }

  // A long-run pace on this device, so an estimate is there from the first tap of a new session.
  private remember(ms: number, steps: number) {
    this.pace = { ms: this.pace.ms + ms, steps: Math.max(0, this.pace.steps + steps) };
    // Recent work matters most: halve the history once it is large.
    if (this.pace.steps > 5000) this.pace = { ms: this.pace.ms / 2, steps: this.pace.steps / 2 };
    // Written now and then, not on every tap: localStorage is synchronous.
    const now = Date.now();
    if (now - this.savedAt < 10_000) return;
    this.savedAt = now;
    this.save();
  }

  /** Keeps the long-run pace on this device (also called when the Tally closes). */
  save() {
    try {
      localStorage.setItem(PACE_KEY, JSON.stringify(this.pace));
    } catch {
      /* pace is a nicety */
    }
  }

  read(now: number): ClockReading {
    const gap = this.lastTap === null ? Infinity : now - this.lastTap;
    const paused = gap >= IDLE_MS;
    const activeMs = this.activeMs + (paused ? 0 : gap);
    const enough = this.steps >= MIN_STEPS && this.activeMs >= MIN_MS;
    const minutes = this.activeMs / 60_000;
    let stepsPerMinute = enough ? this.steps / minutes : null;
    if (stepsPerMinute === null && this.pace.steps >= MIN_STEPS && this.pace.ms >= MIN_MS)
      stepsPerMinute = this.pace.steps / (this.pace.ms / 60_000);
    return {
      activeMs,
      paused: this.lastTap !== null && paused,
      steps: this.steps,
      stitches: this.stitches,
      stepsPerMinute,
      stitchesPerMinute: enough ? this.stitches / minutes : null,
    };
  }
}

/** "1 h 05 min", "12 min", "under a minute". */
export function formatDuration(ms: number) {
  const minutes = Math.round(ms / 60_000);
  if (minutes < 1) return 'under a minute';
  if (minutes < 60) return `${minutes} min`;
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  return m ? `${h} h ${String(m).padStart(2, '0')} min` : `${h} h`;
}
