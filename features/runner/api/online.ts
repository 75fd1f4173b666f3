'use client';

import { onlineManager } from '@tanstack/react-query';
import { useSyncExternalStore } from 'react';

// Query assumes "online" until the browser fires an `offline` event, but a runner page reloaded
// offline (from the service worker's copy) gets no such event: ask the browser at the start too,
// so the outbox pauses instead of failing its first send, and the screen says "offline".
if (typeof window !== 'undefined') {
  onlineManager.setEventListener((setOnline) => {
    const update = () => setOnline(navigator.onLine);
    update();
    window.addEventListener('online', update);
    window.addEventListener('offline', update);
    return () => {
      window.removeEventListener('online', update);
      window.removeEventListener('offline', update);
    };
  });
}

/** Whether the phone has a network, as Query sees it (its mutations pause and resume on this). */
export function useOnline(): boolean {
  return useSyncExternalStore(
    (change) => onlineManager.subscribe(change),
    () => onlineManager.isOnline(),
    () => true,
  );
}
