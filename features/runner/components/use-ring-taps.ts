'use client';

import { useCallback, useLayoutEffect, useRef } from 'react';
import type { RunEvent } from '../events';
import { useConfirmBolt, type UsedWrench } from './use-confirm-bolt';

/**
 * The pass ring's confirm and undo as functions that never change. They act on what the latest
 * render showed (the pass, the wrench and its setting), so the memoised ring is redrawn for new
 * progress and never because its handlers were made again.
 */
export function useRingTaps(
  record: (e: RunEvent) => Promise<void>,
  onConfirmed: () => void,
  shown: { pass: number; used: UsedWrench | null },
) {
  const confirmBolt = useConfirmBolt(record, onConfirmed);
  const latest = useRef({ confirmBolt, ...shown });
  useLayoutEffect(() => {
    latest.current = { confirmBolt, ...shown };
  });
  const confirm = useCallback((at: number, bolt: number, turned?: boolean) => {
    const { confirmBolt: confirmNow, pass, used } = latest.current;
    confirmNow(at, { pass, bolt, turned }, used);
  }, []);
  const undo = useCallback(
    (tap: { pass: number; bolt: number }) => void record({ type: 'bolt_undone', payload: tap }),
    [record],
  );
  return { confirm, undo };
}
