'use client';

import { useRef } from 'react';
import type { Torque } from '@/features/torque-plan';
import { tapCounts } from '../double-tap';
import type { RunEvent } from '../events';
import { useRunnerSettings } from '../settings-store';

/** A short buzz and, when asked for, the words spoken: the technician's eyes are on the wrench. */
export function cue(text: string, speak: boolean, vibrate: boolean) {
  if (vibrate && 'vibrate' in navigator) navigator.vibrate(40);
  if (speak && 'speechSynthesis' in window) {
    window.speechSynthesis.cancel();
    window.speechSynthesis.speak(new SpeechSynthesisUtterance(text));
  }
}

/** What was used for a bolt, as shown at the moment of the tap. */
export type UsedWrench = { wrench: { id: string }; setting: Torque };

/** One tap: which pass and bolt, and on a check pass whether it turned. */
export type BoltTap = { pass: number; bolt: number; turned?: boolean };

/**
 * The tap on "Clicked — bolt N" (and its check-pass and out-of-sequence twins): drops a gloved
 * thumb's bounce, records the bolt with the wrench and setting shown, buzzes, then `onConfirmed`.
 * The last tap's time outlives a pass change, so a bounce on the next pass's first bolt is caught.
 */
export function useConfirmBolt(record: (e: RunEvent) => Promise<void>, onConfirmed: () => void) {
  const lastTap = useRef<number | null>(null);
  // `at`: the tap's own time stamp (the event's), so two taps are compared on one clock.
  return (at: number, { pass, bolt, turned }: BoltTap, used: UsedWrench | null) => {
    if (!tapCounts(lastTap.current, at)) return;
    lastTap.current = at;
    // What was used, as shown at this moment: the wrench and its setting travel with the bolt.
    const withWrench = used ? { wrenchId: used.wrench.id, setting: used.setting } : {};
    void record({
      type: 'bolt_confirmed',
      payload: { pass, bolt, ...withWrench, ...(turned === undefined ? {} : { turned }) },
    });
    // Read at the tap, not subscribed to: the panel holding this hook is not redrawn when the
    // phone's settings change, and the buzz still follows the setting as it is now.
    cue(`Bolt ${bolt} done`, false, useRunnerSettings.getState().vibrate);
    onConfirmed();
  };
}
