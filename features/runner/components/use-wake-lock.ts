'use client';

import { useEffect, useState, useSyncExternalStore } from 'react';

const noop = () => () => {};

/** Keeps the screen on while the runner is open; says so where the browser cannot. */
export function useWakeLock(): 'on' | 'unsupported' | 'off' {
  const supported = useSyncExternalStore(
    noop,
    () => 'wakeLock' in navigator,
    () => true,
  );
  const [on, setOn] = useState(false);
  useEffect(() => {
    if (!supported) return;
    let lock: WakeLockSentinel | null = null;
    const acquire = () =>
      navigator.wakeLock
        .request('screen')
        .then((l) => {
          lock = l;
          setOn(true);
          l.addEventListener('release', () => setOn(false));
        })
        .catch(() => setOn(false));
    void acquire();
    const again = () => {
      if (document.visibilityState === 'visible') void acquire();
    };
    document.addEventListener('visibilitychange', again);
    return () => {
      document.removeEventListener('visibilitychange', again);
      void lock?.release();
    };
  }, [supported]);
  return !supported ? 'unsupported' : on ? 'on' : 'off';
}
