/**
 * `npm start` and `npm run dev`: everything one machine needs to serve Ringpass with its demo shop.
 *   1. PostgreSQL: DATABASE_URL when it is set, else the project's own cluster (db/cluster.ts);
 *   2. migrations, then the demo shop;
 *   3. mail: SMTP_URL when it is set, else the local sink and the Mailbox page;
 *   4. `next build` + `next start` (or `next dev`) on HOST:PORT (127.0.0.1:3000), sign-ins printed.
 * A production start (NODE_ENV=production without RINGPASS_DEMO=true) does none of the demo's
 * shortcuts and stops unless every service is configured (server/dev/stack-plan.ts).
 */
import { spawn, spawnSync } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { clusterUrl, ensureDatabase, startCluster } from '@/db/cluster';
import { migrateDatabase } from '@/db/migrate';
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_SHOP, seedDemoShop } from '@/db/seed';
import { startMailSink } from './mail-sink';
import { planStack } from './stack-plan';
import { startUploadFake } from './upload-fake';
import { spawnWorker, stopWorker } from './worker-process';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const SINK_PORT = 2525;
const UPLOAD_PORT = 2530;
const NEXT = path.join(ROOT, 'node_modules', '.bin', 'next');

async function main(mode: 'start' | 'dev') {
  const plan = planStack(process.env);
  if (!plan.ok) throw new Error(plan.message);
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    ...plan.processEnv,
    NEXT_TELEMETRY_DISABLED: '1',
    APP_URL: plan.appUrl,
    HOST: plan.host,
    PORT: String(plan.port),
  };

  if (plan.localCluster) {
    await startCluster();
    await ensureDatabase('ringpass');
  }
  const databaseUrl = plan.localCluster ? clusterUrl('ringpass') : String(env.DATABASE_URL);
  env.DATABASE_URL = process.env.DATABASE_URL = databaseUrl;
  await migrateDatabase(databaseUrl);
  const seeded = plan.seedDemoShop
    ? await seedDemoShop(databaseUrl, { photoDir: path.join(ROOT, '.data', 'uploads') })
    : undefined;

  let closeSink = async () => {};
  if (plan.mailSink) {
    const dir = path.join(ROOT, '.data', 'mailbox');
    const sink = await startMailSink({
      port: SINK_PORT,
      dir,
      onUnowned: (mail) => {
        const links = mail.text.match(/https?:\/\/\S+/g) ?? [];
        console.log(
          `[mail] to ${mail.to.join(', ')}: ${mail.subject}${links.length ? `\n[mail]   ${links.join('\n[mail]   ')}` : ''}`,
        );
      },
    });
    closeSink = sink.close;
    env.SMTP_URL = `smtp://127.0.0.1:${SINK_PORT}`;
    env.MAILBOX_DIR = dir;
    // `next start` runs as production, where the Mailbox exists only for a demo (with a banner).
    env.MAILBOX_DEMO = 'true';
  }
  let closeUploads = async () => {};
  if (plan.uploadFake) {
    const fake = await startUploadFake({
      port: UPLOAD_PORT,
      dir: path.join(ROOT, '.data', 'uploads'),
    });
    closeUploads = fake.close;
    Object.assign(env, fake.env);
  }
  // Plain http on this machine: the cookie cannot be Secure. A deployment behind TLS leaves this unset.
  if (plan.demo && env.APP_URL?.startsWith('http://')) env.COOKIE_SECURE ??= 'false';

  if (mode === 'start') {
    console.log('[start] building the app (next build)…');
    const build = spawnSync(NEXT, ['build'], {
      cwd: ROOT,
      env: { ...env, NODE_ENV: 'production' },
      stdio: 'inherit',
    });
    if (build.status !== 0) throw new Error('next build failed');
  }

  const nodeEnv = mode === 'start' ? 'production' : 'development';
  const child = spawn(NEXT, [mode, '-H', plan.host, '-p', String(plan.port)], {
    cwd: ROOT,
    env: { ...env, NODE_ENV: nodeEnv },
    stdio: 'inherit',
  });
  // The queue's worker (mail, the re-check reminders, the hourly wrench sweep), stopped with the app.
  const worker = plan.worker ? spawnWorker({ ...env, NODE_ENV: nodeEnv }) : undefined;

  if (seeded) {
    console.log(
      `\nRingpass: ${env.APP_URL}  (${seeded.created ? 'demo shop created' : 'demo shop already there'})`,
    );
    console.log(`Demo shop "${DEMO_SHOP}", password for everyone: ${DEMO_PASSWORD}`);
    for (const p of DEMO_PEOPLE) console.log(`  ${p.role.padEnd(10)} ${p.email}`);
  } else {
    console.log(`\nRingpass: ${env.APP_URL} (listening on ${plan.host}:${plan.port})`);
  }
  if (env.MAILBOX_DIR) console.log(`Mail goes to the local sink: ${env.APP_URL}/mailbox`);
  if (!worker) console.log('No queue worker here (RINGPASS_WORKER=false): run `npm run worker`.');
  if (env.UPLOADTHING_INGEST_URL?.includes('127.0.0.1'))
    console.log(
      `Photos go to the local upload fake: ${env.UPLOADTHING_INGEST_URL} (files in .data/uploads)`,
    );
  console.log(
    plan.localCluster
      ? 'Stop with Ctrl+C; the database keeps running (npm run db:stop).\n'
      : 'Stop with Ctrl+C.\n',
  );

  const stop = (signal: NodeJS.Signals) => child.kill(signal);
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
  child.on('exit', (code) => {
    void (worker ? stopWorker(worker) : Promise.resolve())
      .then(() => Promise.all([closeSink(), closeUploads()]))
      .finally(() => process.exit(code ?? 0));
  });
}

const mode = process.argv[2];
if (mode !== 'start' && mode !== 'dev') {
  console.error('usage: tsx server/dev/stack.ts start | dev');
  process.exit(2);
}
main(mode).catch((error: unknown) => {
  console.error(`[start] ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
