import postgres from 'postgres';
import { afterAll, beforeAll, vi } from 'vitest';
import { clusterUrl } from '@/db/cluster';
import { INTEGRATION_SINK, TEMPLATE_DB } from './test-services';
import { resetNextRequest } from './next-request';

// Each test file gets its own database, copied from the migrated template: files never see
// each other's rows, and workers can run in parallel.
const database = `ringpass_test_${process.env.VITEST_POOL_ID ?? '0'}`;
Object.assign(process.env, {
  NODE_ENV: 'test',
  DATABASE_URL: clusterUrl(database),
  SMTP_URL: `smtp://127.0.0.1:${INTEGRATION_SINK.port}`,
  MAILBOX_DIR: INTEGRATION_SINK.dir,
  APP_URL: 'http://127.0.0.1:3000',
  // A photo store nobody listens on (port 9, discard): reports built without the upload fake
  // find their photos unreadable at once. A missing token would fail every report with photos,
  // as it must in a server. Tests that read photos start the fake and set its own variables.
  UPLOADTHING_TOKEN: Buffer.from(
    JSON.stringify({ apiKey: 'sk_test_none', appId: 'ringpass-test', regions: ['local'] }),
  ).toString('base64'),
  UPLOADTHING_UFS_HOST: 'localhost:9',
  UPLOADTHING_UFS_APP_ID_LOCATION: 'path',
});

vi.mock('next/headers', async () => (await import('./next-request')).nextHeadersMock);
// Cache invalidation needs Next's render store; the tests read the database instead.
vi.mock('next/cache', () => ({ revalidatePath: () => {}, revalidateTag: () => {} }));

beforeAll(async () => {
  const admin = postgres(clusterUrl('postgres'), { max: 1, onnotice: () => {} });
  await admin.unsafe(`drop database if exists ${database} with (force)`);
  await admin.unsafe(`create database ${database} template ${TEMPLATE_DB}`);
  await admin.end();
  resetNextRequest();
});

afterAll(async () => {
  const { stopBoss } = await import('@/server/queue/boss');
  await stopBoss();
  const { closeDb } = await import('@/db');
  await closeDb();
});
