// @vitest-environment jsdom
// A tap is drawn before the phone's storage is touched: IndexedDB clones the whole outbox when it
// writes, which would otherwise land in the frame the technician is waiting for.
import 'fake-indexeddb/auto';
import { act, renderHook, waitFor } from '@testing-library/react';
import type * as idb from 'idb-keyval';
import { clear, set } from 'idb-keyval';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { afterPaint } from '@/features/runner/api/after-paint';
import {
  useRunQueue,
  type QueuePerson,
  type SaveEvents,
} from '@/features/runner/api/use-run-queue';

vi.mock('idb-keyval', async (importOriginal) => {
  const real = await importOriginal<typeof idb>();
  return { ...real, set: vi.fn(real.set) };
});

const WHEEL = '9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d';
const THEO: QueuePerson = { id: '0b6f9a52-56a4-4c6e-8a39-8d3c3f1e0a01', name: 'Theo Tech' };

/** Animation frames held until `paint()`, as a browser runs them only when it draws. */
function holdFrames() {
  const frames: FrameRequestCallback[] = [];
  vi.stubGlobal('requestAnimationFrame', (cb: FrameRequestCallback) => frames.push(cb));
  return { paint: () => frames.splice(0).forEach((cb) => cb(performance.now())) };
}

describe('the runner writes a tap to the phone after the frame that shows it', () => {
  beforeEach(async () => {
    await clear();
    sessionStorage.clear();
    vi.mocked(set).mockClear();
  });
  afterEach(() => vi.unstubAllGlobals());

  it('shows the tap at once, writes it once the frame is painted, then sends it', async () => {
    const action = vi.fn<SaveEvents>(async () => ({
      ok: true as const,
      data: { saved: 1, duplicates: 0 },
    }));
    const hook = renderHook(() => useRunQueue(WHEEL, [], action, THEO));
    await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
    const frames = holdFrames();
    vi.mocked(set).mockClear();

    let recorded!: Promise<void>;
    act(() => {
      recorded = hook.result.current.record({
        type: 'bolt_confirmed',
        payload: { pass: 1, bolt: 3 },
      });
    });
    expect(hook.result.current.status.waiting).toBe(1);
    expect(set).not.toHaveBeenCalled();
    expect(action).not.toHaveBeenCalled();

    frames.paint();
    await act(() => recorded);
    expect(set).toHaveBeenCalled();
    await waitFor(() => expect(hook.result.current.status.waiting).toBe(0));
    expect(action).toHaveBeenCalledTimes(1);
  });

  it('a visible page that paints no frame still writes within a tenth of a second', async () => {
    holdFrames();
    const started = performance.now();
    await afterPaint();
    expect(performance.now() - started).toBeLessThan(1000);
    expect(performance.now() - started).toBeGreaterThanOrEqual(90);
  });

  it('a hidden page (the phone locked, the app switched) writes at once', async () => {
    holdFrames();
    vi.spyOn(document, 'visibilityState', 'get').mockReturnValue('hidden');
    let resolved = false;
    void afterPaint().then(() => (resolved = true));
    await Promise.resolve();
    expect(resolved).toBe(true);
    vi.restoreAllMocks();
  });

  it('a page being hidden or closed while the tap waits for its frame writes at once', async () => {
    holdFrames();
    let resolved = false;
    void afterPaint(10_000).then(() => (resolved = true));
    await Promise.resolve();
    expect(resolved).toBe(false);
    window.dispatchEvent(new Event('pagehide'));
    await Promise.resolve();
    expect(resolved).toBe(true);
  });
});
