/**
 * The e2e web server: a fresh database and mail sink, then the production build of the app on
 * 127.0.0.1:3100 (built into .next-e2e so a running `npm start` is left alone).
 */
import { spawn, spawnSync } from 'node:child_process';
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { clusterUrl, recreateDatabase, startCluster } from '@/db/cluster';
import { migrateDatabase } from '@/db/migrate';
import { startMailSink } from '@/server/dev/mail-sink';
import { startUploadFake } from '@/server/dev/upload-fake';
import { spawnWorker, stopWorker } from '@/server/dev/worker-process';
import { E2E, ROOT } from '../helpers/test-services';
import { builtFrom, sourceFingerprint, stampBuild } from './build-fingerprint';

async function main() {
  await startCluster();
  await recreateDatabase(E2E.database);
  await migrateDatabase(clusterUrl(E2E.database));
  rmSync(E2E.sink.dir, { recursive: true, force: true });
  const sink = await startMailSink(E2E.sink);
  rmSync(E2E.uploads.dir, { recursive: true, force: true });
  const uploads = await startUploadFake(E2E.uploads);

  const settings = {
    NODE_ENV: 'production' as const,
    NEXT_TELEMETRY_DISABLED: '1',
    NEXT_DIST_DIR: '.next-e2e',
    DATABASE_URL: clusterUrl(E2E.database),
    APP_URL: `http://127.0.0.1:${E2E.appPort}`,
    SMTP_URL: `smtp://127.0.0.1:${E2E.sink.port}`,
    MAILBOX_DIR: E2E.sink.dir,
    // A production build: the Mailbox, through which the tests read mail as a lead, needs the demo flag.
    MAILBOX_DEMO: 'true',
    COOKIE_SECURE: 'false',
    // The types are checked once per `npm test`, by its typecheck step, not again inside the build.
    RINGPASS_BUILD_SKIP_TYPECHECK: '1',
  };
  const env = { ...process.env, ...settings, ...uploads.env };
  // The upload fake's key is new on every start and read only at run time: not part of the build.
  const fingerprint = sourceFingerprint(ROOT, settings);
  const next = path.join(ROOT, 'node_modules', '.bin', 'next');
  const build = () => {
    rmSync(path.join(E2E.distDir, 'BUILD_ID'), { force: true });
    if (spawnSync(next, ['build'], { cwd: ROOT, env, stdio: 'inherit' }).status !== 0)
      throw new Error('next build failed');
    stampBuild(E2E.distDir, fingerprint);
  };
  const start = () =>
    spawn(next, ['start', '-H', '127.0.0.1', '-p', String(E2E.appPort)], {
      cwd: ROOT,
      env,
      stdio: 'inherit',
    });
  // One build per run at most, none when .next-e2e was built from these very sources (a developer
  // running one spec after another); E2E_REBUILD=1 builds regardless.
  if (process.env.E2E_REBUILD || !builtFrom(E2E.distDir, fingerprint)) build();
  else console.log('[e2e] the sources are unchanged since the last e2e build: reusing .next-e2e');
  let server = start();
  // The queue's worker: invites, notices and the customer's mail arrive through it, as in production.
  const worker = spawnWorker(env);
  let redeploying = false;
  const onExit = (code: number | null) => {
    if (!redeploying)
      void stopWorker(worker)
        .then(() => Promise.all([sink.close(), uploads.close()]))
        .finally(() => process.exit(code ?? 0));
  };
  server.on('exit', onExit);
  process.on('SIGTERM', () => server.kill('SIGTERM'));
  process.on('SIGINT', () => server.kill('SIGTERM'));

  // A deploy, for the test of confirmations queued across builds: stop, build anew, start again.
  process.on('SIGUSR2', () => {
    redeploying = true;
    console.log('[e2e] redeploy: stopping the server, then building anew');
    // Next stops on SIGTERM once its requests end; one left hanging must not stall the deploy.
    const stubborn = setTimeout(() => {
      console.log('[e2e] redeploy: the server did not stop in 15 s; killing it');
      server.kill('SIGKILL');
    }, 15_000);
    server.once('exit', () => {
      clearTimeout(stubborn);
      // A build machine starts clean: without Next's cached key the new build gets new action ids.
      rmSync(path.join(E2E.distDir, 'cache', '.rscinfo'), { force: true });
      build();
      server = start();
      server.on('exit', onExit);
      redeploying = false;
    });
    server.kill('SIGTERM');
  });
  mkdirSync(path.dirname(E2E.servePidFile), { recursive: true });
  writeFileSync(E2E.servePidFile, String(process.pid));
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
