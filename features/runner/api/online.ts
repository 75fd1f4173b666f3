'use client';

import { useSyncExternalStore } from 'react';

function subscribe(change: () => void) {
  window.addEventListener('online', change);
  window.addEventListener('offline', change);
  return () => {
    window.removeEventListener('online', change);
    window.removeEventListener('offline', change);
  };
}

/**
 * Whether the phone has a network, as the browser says: the source the sender's onlineManager
 * follows too (./run-sender), read here without Query so the header knows before the sender loads.
 */
export function useOnline(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => navigator.onLine,
    () => true,
  );
}
