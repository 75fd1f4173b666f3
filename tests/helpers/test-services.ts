import path from 'node:path';

/** Fixed loopback ports and folders for the test services (apart from `npm start`'s). */
export const ROOT = path.resolve(import.meta.dirname, '..', '..');
export const INTEGRATION_SINK = { port: 2527, dir: path.join(ROOT, '.data', 'test-mailbox') };
export const E2E = {
  appPort: 3100,
  sink: { port: 2528, dir: path.join(ROOT, '.data', 'e2e-mailbox') },
  uploads: { port: 2531, dir: path.join(ROOT, '.data', 'e2e-uploads') },
  database: 'ringpass_e2e',
  /** The e2e server's pid: SIGUSR2 makes it redeploy (stop, build anew, start). */
  servePidFile: path.join(ROOT, '.data', 'e2e-serve.pid'),
  distDir: path.join(ROOT, '.next-e2e'),
};
export const TEMPLATE_DB = 'ringpass_test_template';
