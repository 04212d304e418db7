import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { act, renderHook, waitFor } from '@testing-library/react';
import { QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { createQueryClient } from '@/lib/query-client';
import { tallyKeys } from '@/features/tally/api/keys';
import { useProgressStream } from '@/features/tally/hooks/use-progress-stream';
import type { PieceProgress } from '@/types/api';

// happy-dom has no EventSource; this stand-in delivers what the server's stream would, so the hook's own handling
// of the events is what is tested.
class StreamStandIn extends EventTarget {
  static last: StreamStandIn | null = null;
  constructor(public url: string) {
    super();
    StreamStandIn.last = this;
  }
  close() {}
  emit(type: string, data?: unknown) {
    this.dispatchEvent(type === 'open' ? new Event('open') : new MessageEvent(type, { data: JSON.stringify(data) }));
  }
}

const at = (version: number, step: number): PieceProgress => ({ copy: 1, round: 0, step, done: step, version, updatedAt: null });

let original: typeof globalThis.EventSource | undefined;
beforeEach(() => {
  original = globalThis.EventSource;
  globalThis.EventSource = StreamStandIn as unknown as typeof EventSource;
});
afterEach(() => {
  globalThis.EventSource = original as typeof EventSource;
  StreamStandIn.last = null;
});

function setup(onPieceChanged?: () => void) {
  const qc = createQueryClient();
  const invalidate = vi.spyOn(qc, 'invalidateQueries').mockResolvedValue();
  const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={qc}>{children}</QueryClientProvider>;
  const view = renderHook(() => useProgressStream(12, onPieceChanged), { wrapper });
  return { qc, invalidate, view, stream: StreamStandIn.last! };
}

describe('the Tally’s live stream', () => {
  it('is live once open, and fetches the position then, for taps made before it listened', async () => {
    const { invalidate, view, stream } = setup();
    expect(stream.url).toBe('/api/pieces/12/stream');
    expect(view.result.current).toBe('connecting');
    act(() => stream.emit('open'));
    expect(view.result.current).toBe('live');
    expect(invalidate).toHaveBeenCalledWith({ queryKey: tallyKeys.progress(12) });
  });

  it('takes another device’s tap without reloading the piece, and reloads the piece when the server moved the count after an edit', async () => {
    const onPieceChanged = vi.fn();
    const { qc, stream } = setup(onPieceChanged);
    act(() => stream.emit('open'));
    act(() => stream.emit('progress', { progress: at(3, 3), opId: 'tap-from-the-tablet' }));
    expect(qc.getQueryData(tallyKeys.progress(12))).toEqual(at(3, 3));
    expect(onPieceChanged).not.toHaveBeenCalled();

    act(() => stream.emit('progress', { progress: at(4, 1), opId: null }));
    await waitFor(() => expect(onPieceChanged).toHaveBeenCalledTimes(1));
    expect(qc.getQueryData(tallyKeys.progress(12))).toEqual(at(4, 1));
  });
});
