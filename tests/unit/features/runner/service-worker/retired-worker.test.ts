import { readFileSync } from 'node:fs';
import path from 'node:path';
import vm from 'node:vm';
import { describe, expect, it } from 'vitest';

// public/runner-sw.js is what a phone still holding the runner's first service worker fetches on
// its update check: run it in a stand-in worker scope and activate it.
const SOURCE = readFileSync(path.join(process.cwd(), 'public', 'runner-sw.js'), 'utf8');

type Worker = { scriptURL: string } | null;

async function activateRetiredWorker(cacheNames: string[], pending: Worker = null) {
  const listeners = new Map<string, (event: unknown) => void>();
  const kept = new Set(cacheNames);
  let unregistered = false;
  let skippedWaiting = false;
  const self = {
    addEventListener: (type: string, listener: (event: unknown) => void) =>
      listeners.set(type, listener),
    skipWaiting: () => {
      skippedWaiting = true;
      return Promise.resolve();
    },
    registration: {
      installing: pending,
      waiting: null,
      unregister: () => {
        unregistered = true;
        return Promise.resolve(true);
      },
    },
  };
  const caches = {
    keys: () => Promise.resolve([...kept]),
    delete: (name: string) => Promise.resolve(kept.delete(name)),
  };
  vm.runInNewContext(SOURCE, { self, caches, URL, Promise });
  listeners.get('install')?.({});
  let work: Promise<unknown> = Promise.resolve();
  listeners.get('activate')?.({ waitUntil: (p: Promise<unknown>) => (work = p) });
  await work;
  return { kept: [...kept], unregistered, skippedWaiting };
}

describe('the retired runner service worker', () => {
  it("deletes the old worker's caches, leaves other caches and unregisters", async () => {
    const result = await activateRetiredWorker([
      'ringpass-runner-pages-v1',
      'ringpass-runner-assets-v1',
      'someone-elses-cache',
    ]);
    expect(result.kept).toEqual(['someone-elses-cache']);
    expect(result.unregistered).toBe(true);
    expect(result.skippedWaiting).toBe(true);
  });

  it("touches nothing while the runner's current worker is installing in the same registration", async () => {
    const result = await activateRetiredWorker(['ringpass-runner-precache-v1'], {
      scriptURL: 'https://shop.example/runner-sw/sw.js',
    });
    expect(result.kept).toEqual(['ringpass-runner-precache-v1']);
    expect(result.unregistered).toBe(false);
  });
});
