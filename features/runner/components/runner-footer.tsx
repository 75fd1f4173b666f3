'use client';

import { memo } from 'react';
import { useRunnerSettings } from '../settings-store';
import { useWakeLock } from './use-wake-lock';

/**
 * This phone's own choices (spoken bolt numbers, a buzz per bolt) and whether the screen stays on.
 * No props: memoised, it redraws only when those choices or the wake lock change, never on a tap.
 */
export const RunnerFooter = memo(function RunnerFooter() {
  const settings = useRunnerSettings();
  const wake = useWakeLock();
  return (
    <footer className="border-paper-line flex flex-wrap items-center gap-3 border-t-2 p-3 text-sm">
      <label className="min-h-touch flex items-center gap-2">
        <input
          type="checkbox"
          className="size-6"
          checked={settings.speak}
          onChange={settings.toggleSpeak}
        />{' '}
        Speak the next bolt
      </label>
      <label className="min-h-touch flex items-center gap-2">
        <input
          type="checkbox"
          className="size-6"
          checked={settings.vibrate}
          onChange={settings.toggleVibrate}
        />{' '}
        Vibrate on each bolt
      </label>
      <span>
        {wake === 'on'
          ? 'Screen stays on.'
          : wake === 'unsupported'
            ? 'This browser cannot keep the screen on: set the screen timeout longer.'
            : ''}
      </span>
    </footer>
  );
});
