'use client';

import { useEffect } from 'react';
import { cacheRunnerPageMessage } from '../service-worker/routes';

/** The runner's service worker (app/runner-sw/[path]/route.ts builds it). */
export const RUNNER_SW_URL = '/runner-sw/sw.js';

/**
 * Mounted by the runner: registers the service worker that lets this page reload without Wi-Fi,
 * then asks it to keep this page. The page was loaded before the worker was in control (the first
 * visit), or through the app's own router (no navigation for the worker to see), so it says so.
 */
export function KeepRunnerOffline() {
  useEffect(() => {
    if (!('serviceWorker' in navigator)) return;
    void navigator.serviceWorker
      .register(RUNNER_SW_URL, { scope: '/' })
      .then(() => navigator.serviceWorker.ready)
      .then((registration) =>
        registration.active?.postMessage(cacheRunnerPageMessage(location.pathname)),
      )
      .catch(() => {});
  }, []);
  return null;
}
