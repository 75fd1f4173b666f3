import { cleanup } from '@testing-library/react';
import { afterAll, afterEach } from 'vitest';

afterEach(() => cleanup());

// A component test's last tap leaves the runner's after-paint fallback timer (at most 100 ms,
// features/runner/api/after-paint.ts) pending; fired after the file's jsdom window is gone, it
// throws "window is not defined" into the run. Let such timers run while the window exists.
afterAll(async () => {
  if (typeof window !== 'undefined') await new Promise((done) => setTimeout(done, 150));
});
import '@testing-library/jest-dom/vitest';
