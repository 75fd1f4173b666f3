/**
 * `npm run bench:runner`: the runner's save path under load, against the production build over
 * loopback.
 * (a) 50 technicians, each confirming a bolt every 2 s (open arrivals, about 25 a second) for 30 s
 *     through the runner's save path (POST /api/wheels/:id/events, as the runner's outbox sends),
 *     signed in; in the same run, single-row inserts straight into PostgreSQL at the same rate.
 * (b) capacity: the rate rises by half, 30 s per step, while the p95 stays at or under 50 ms.
 * (d) what the framework costs with no database work: a server action (practice's start, posted
 *     to the practice page) and a route handler each answering a call with no session, 25 a
 *     second, 5 s of each in turn, twice; latency and server CPU per call. (The former (e), the
 *     practice save as an action beside its route handler, left with that action: practice saves
 *     through its route handler as the runner does.)
 * (c) statements per confirmation: 200 confirmations one after another, counted from the
 *     database's own statistics (pg_stat_database: transactions, rows written).
 * Each confirmation is what the runner sends on a bolt: `bolt_confirmed` naming the pass's wrench
 * and its setting, after a `wrench_chosen` for each pass (sent once per technician before timing),
 * so the save path's wrench checks run on every tap. `BENCH_EVENTS=plain` sends bolts without a
 * wrench (the bench before the wrench checks).
 * The machine has 2 cores: once the build is done, the server is pinned to core 0 and this load
 * generator to core 1 (`taskset`, util-linux), so the generator's own work does not queue behind the
 * server's and stop measuring itself. PostgreSQL is a shared cluster and is not pinned.
 * `BENCH_PIN=0` leaves both unpinned.
 * `BENCH_CPU_PROFILE=1` has the server write a V8 CPU profile into `.next-profiles/` when it stops
 * (Next's own profiler, NEXT_CPU_PROF; Node refuses --cpu-prof in NODE_OPTIONS). Open it in
 * Chrome's DevTools, Performance.
 * Last two lines: `capacity N confirmations/s at p95 <= 50 ms` and
 * `confirm p95 X ms, raw insert p95 Y ms, ratio Z`.
 */
import path from 'node:path';
import postgres from 'postgres';
import { clusterUrl, recreateDatabase, startCluster } from '@/db/cluster';
import { migrateDatabase } from '@/db/migrate';
import { newEventId } from '@/features/runner/event-id';
import { serverActionId } from '../helpers/next-build';
import { newSessionToken } from '../helpers/session-row';
import { ROOT } from '../helpers/test-services';
import { pct, run, startProductionServer } from './production-server';
import { cpuMs, httpClient, listenerPid, load, pin } from './runner-load';

const DB = 'ringpass_bench_runner';
const PORT = 3201;
const TECHS = 50;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 30);
const BASE = `http://127.0.0.1:${PORT}`;
const WITH_WRENCH = process.env.BENCH_EVENTS !== 'plain';
const PIN = process.env.BENCH_PIN !== '0';
// The bench spec's plan: 30 %, 70 %, 100 % of 12 ft-lb, then the check pass at 100 %.
const SETTINGS = [3.6, 8.4, 12, 12];
const { post, close: closeClient } = httpClient(BASE);

type Tech = {
  cookie: string;
  wheelId: string;
  jobId: string;
  userId: string;
  shopId: string;
  wrenchId: string;
  n: number;
};

async function seed(sql: postgres.Sql): Promise<Tech[]> {
  const [shop] = await sql`insert into shops (name) values ('Bench runner shop') returning id`;
  const shopId = shop!.id as string;
  const [lead] =
    await sql`insert into users (shop_id, email, name, role, password_hash) values (${shopId}, 'lead@bench.test', 'Lead', 'lead', 'x') returning id`;
  const [spec] = await sql`
    insert into wheel_specs (shop_id, name, bolt_count, bolt_thread, final_torque, torque_unit, pass_fractions, pattern_kind, max_bead_seat_pressure, running_pressure, pressure_unit)
    values (${shopId}, 'Bench 32', 32, 'M8', 12, 'lbf-ft', '[0.3,0.7,1]', 'cross', 30, 14, 'psi') returning id`;
  const [customer] =
    await sql`insert into customers (shop_id, name) values (${shopId}, 'Bench customer') returning id`;
  const [vehicle] =
    await sql`insert into vehicles (shop_id, customer_id, make) values (${shopId}, ${customer!.id}, 'Make') returning id`;
  const techs: Tech[] = [];
  for (let i = 0; i < TECHS; i++) {
    const [u] =
      await sql`insert into users (shop_id, email, name, role, password_hash) values (${shopId}, ${`t${i}@bench.test`}, ${`Tech ${i}`}, 'technician', 'x') returning id`;
    const [job] =
      await sql`insert into jobs (shop_id, number, customer_id, vehicle_id, state, assignee_id, created_by_id) values (${shopId}, ${1000 + i}, ${customer!.id}, ${vehicle!.id}, 'in_progress', ${u!.id}, ${lead!.id}) returning id`;
    const [wheel] =
      await sql`insert into job_wheels (shop_id, job_id, position, spec_id, tire_size, target_pressure, pressure_unit) values (${shopId}, ${job!.id}, 'LF', ${spec!.id}, '30x10R14', 14, 'psi') returning id`;
    // Each technician's own click wrench, verified today near every pass's setting (±25 %).
    const [wrench] =
      await sql`insert into wrenches (shop_id, label, kind, min, max, unit, graduation, calibration_due_on, cycles_since_calibration) values (${shopId}, ${`W${i}`}, 'click', 1, 15, 'lbf-ft', 0.1, current_date + 180, 0) returning id`;
    for (const reference of [3.6, 8.4, 12])
      await sql`insert into wrench_verifications (shop_id, wrench_id, reference_value, reading_value, unit, deviation_pct, tolerance_pct, within_tolerance, recorded_by_id) values (${shopId}, ${wrench!.id}, ${reference}, ${reference}, 'lbf-ft', 0, 4, true, ${u!.id})`;
    const session = newSessionToken();
    await sql`insert into sessions (id, user_id, expires_at, absolute_expires_at) values (${session.id}, ${u!.id}, now() + interval '1 day', now() + interval '1 day')`;
    techs.push({
      cookie: `ringpass_session=${session.token}`,
      wheelId: wheel!.id,
      jobId: job!.id,
      userId: u!.id,
      shopId,
      wrenchId: wrench!.id,
      n: 0,
    });
  }
  return techs;
}

function confirmEvents(t: Tech) {
  const k = t.n++;
  const pass = 1 + (Math.floor(k / 32) % 4);
  const wrench = { wrenchId: t.wrenchId, setting: { value: SETTINGS[pass - 1]!, unit: 'lbf-ft' } };
  return [
    {
      type: 'bolt_confirmed',
      payload: { pass, bolt: 1 + (k % 32), ...(WITH_WRENCH ? wrench : {}) },
      // Time-ordered ids, as the runner's outbox makes them (event-id.ts).
      clientId: newEventId(),
      clientAt: new Date().toISOString(),
    },
  ];
}

/** "Wrench set" on each of the four passes, as the runner records it before a pass's first bolt. */
function wrenchChosenEvents(t: Tech) {
  return SETTINGS.map((_, i) => ({
    type: 'wrench_chosen',
    payload: { pass: i + 1, wrenchId: t.wrenchId },
    clientId: newEventId(),
    clientAt: new Date().toISOString(),
  }));
}

/** One confirmation as the runner's outbox sends it (features/runner/api/post-events.ts). */
async function confirm(t: Tech, events: unknown[] = confirmEvents(t)): Promise<number> {
  const started = performance.now();
  const headers = { cookie: t.cookie, origin: BASE, 'content-type': 'application/json' };
  const res = await post(`/api/wheels/${t.wheelId}/events`, headers, JSON.stringify({ events }));
  if (res.status !== 200 || !res.text.includes('{"data":{') || !res.text.includes('"refused":[]'))
    throw new Error(`confirm answered ${res.status}: ${res.text.slice(0, 200)}`);
  return performance.now() - started;
}

/**
 * The framework alone: a server action (practice's start, posted to the practice page with its id
 * from the build, arguments as React encodes plain JSON) and a route handler, each refusing a call
 * with no session.
 */
let actionId = '';
async function signedOut(t: Tech, kind: 'action' | 'route'): Promise<number> {
  const started = performance.now();
  const res =
    kind === 'action'
      ? await post(
          '/practice',
          {
            origin: BASE,
            'content-type': 'text/plain;charset=UTF-8',
            accept: 'text/x-component',
            'next-action': actionId,
          },
          JSON.stringify([null, { source: 'surprise', level: 'guided' }]),
        )
      : await post(
          `/api/wheels/${t.wheelId}/submit`,
          { origin: BASE, 'content-type': 'application/json' },
          '{}',
        );
  const refused = kind === 'action' ? res.text.includes('"unauthenticated"') : res.status === 401;
  if (!refused)
    throw new Error(`signed-out ${kind} answered ${res.status}: ${res.text.slice(0, 200)}`);
  return performance.now() - started;
}

/** The floor: one row straight into PostgreSQL, keyed by the same time-ordered id as the app's. */
async function rawInsert(sql: postgres.Sql, t: Tech): Promise<number> {
  const started = performance.now();
  await sql`insert into wheel_run_events (shop_id, job_id, wheel_id, client_id, type, payload, by_id, client_at) values (${t.shopId}, ${t.jobId}, ${t.wheelId}, ${newEventId()}, 'bench_raw', ${sql.json({ pass: 1, bolt: 1 })}, ${t.userId}, now())`;
  return performance.now() - started;
}

type DbCounts = {
  xact: number;
  inserted: number;
  updated: number;
  deleted: number;
  activeMs: number;
};
async function dbCounts(sql: postgres.Sql): Promise<DbCounts> {
  // Backends flush their statistics at most once a second and, when idle, within 10 s.
  await new Promise((r) => setTimeout(r, 11_000));
  const [row] = await sql`
    select xact_commit + xact_rollback as xact, tup_inserted as inserted, tup_updated as updated, tup_deleted as deleted, active_time as active_ms
    from pg_stat_database where datname = current_database()`;
  return {
    xact: Number(row!.xact),
    inserted: Number(row!.inserted),
    updated: Number(row!.updated),
    deleted: Number(row!.deleted),
    activeMs: Number(row!.active_ms),
  };
}

/**
 * Statements per confirmation: each statement outside a transaction commits as one transaction, so
 * on the quick path the database's transaction count is its statement count (a transaction block,
 * BEGIN to COMMIT, counts once whatever it holds). The generator's own reads add one or two in 200.
 */
async function countPerConfirmation(sql: postgres.Sql, techs: Tech[], serverPid: number, n = 200) {
  const before = await dbCounts(sql);
  const cpuBefore = cpuMs(serverPid);
  const times: number[] = [];
  for (let i = 0; i < n; i++) times.push(await confirm(techs[i % TECHS]!));
  const cpu = (cpuMs(serverPid) - cpuBefore) / n;
  const after = await dbCounts(sql);
  const per = (k: keyof DbCounts) => ((after[k] - before[k]) / n).toFixed(2);
  console.log(
    `[bench] (c) per confirmation: ${per('xact')} statements (transactions), rows inserted ${per('inserted')}, updated ${per('updated')}, deleted ${per('deleted')}`,
  );
  // CPU and database time barely depend on what else the machine runs; latency does.
  console.log(
    `[bench] (c) one at a time: p50 ${pct(times, 50).toFixed(2)} ms; Next server CPU ${cpu.toFixed(2)} ms, database active ${per('activeMs')} ms per confirmation`,
  );
}

async function main() {
  await startCluster();
  await recreateDatabase(DB);
  await migrateDatabase(clusterUrl(DB));
  const sql = postgres(clusterUrl(DB), { max: 10, onnotice: () => {} });
  const techs = await seed(sql);
  const server = await startProductionServer(
    PORT,
    clusterUrl(DB),
    process.env.BENCH_CPU_PROFILE === '1' ? { NEXT_CPU_PROF: '1' } : {},
  );
  actionId = serverActionId(path.join(ROOT, server.distDir), 'startPracticeAttempt');
  // "Wrench set" for each pass on every wheel (this also takes each wheel's snapshot); fails loudly
  // when the save's address is wrong or a wrench is refused.
  for (const t of techs) await confirm(t, WITH_WRENCH ? wrenchChosenEvents(t) : confirmEvents(t));
  const serverPid = listenerPid(PORT);
  if (PIN) {
    pin(serverPid, 0);
    pin(process.pid, 1);
  }
  console.log(
    `[bench] events ${WITH_WRENCH ? 'naming their wrench' : 'plain'}; ${PIN ? 'server on core 0, generator on core 1' : 'unpinned'}`,
  );
  try {
    await load(25, 4, (i) => confirm(techs[i % TECHS]!)); // warm-up
    await countPerConfirmation(sql, techs, serverPid);

    // (a) 50 technicians at one bolt every 2 s each, beside raw inserts at the same rate.
    const rate = TECHS / 2;
    const [app, raw] = await Promise.all([
      load(rate, SECONDS, (i) => confirm(techs[i % TECHS]!)),
      load(rate, SECONDS, (i) => rawInsert(sql, techs[i % TECHS]!)),
    ]);
    console.log(
      `[bench] (a) ${app.times.length} confirmations in ${SECONDS} s (${app.errors} errors): p50 ${pct(app.times, 50).toFixed(1)} ms, p95 ${pct(app.times, 95).toFixed(1)} ms; raw insert p50 ${pct(raw.times, 50).toFixed(2)} ms, p95 ${pct(raw.times, 95).toFixed(2)} ms`,
    );

    // (d) the framework's own cost per call, no database work on either side: 5 s of each in
    // turn, twice (A B A B), so a change in the machine's other load falls on both.
    const floor = {
      action: { times: [] as number[], errors: 0, cpu: 0 },
      route: { times: [] as number[], errors: 0, cpu: 0 },
    };
    for (let round = 0; round < 2; round++) {
      for (const kind of ['action', 'route'] as const) {
        const cpuBefore = cpuMs(serverPid);
        const step = await load(25, 5, (i) => signedOut(techs[i % TECHS]!, kind));
        floor[kind].cpu += cpuMs(serverPid) - cpuBefore;
        floor[kind].times.push(...step.times);
        floor[kind].errors += step.errors;
      }
    }
    for (const kind of ['action', 'route'] as const) {
      const f = floor[kind];
      console.log(
        `[bench] (d) signed-out ${kind === 'action' ? 'server action' : 'route handler'}: p50 ${pct(f.times, 50).toFixed(1)} ms, p95 ${pct(f.times, 95).toFixed(1)} ms, server CPU ${(f.cpu / (f.times.length + f.errors)).toFixed(2)} ms per call (${f.errors} errors)`,
      );
    }

    // (b) capacity: raise the rate by half while p95 stays within 50 ms and nothing fails.
    let best = 0;
    for (let r = 50; r <= 3200; r = Math.round(r * 1.5)) {
      const step = await load(r, SECONDS, (i) => confirm(techs[i % TECHS]!));
      const p95 = pct(step.times, 95);
      console.log(
        `[bench] (b) ${r}/s for ${SECONDS} s: p95 ${p95.toFixed(1)} ms, ${step.errors} errors`,
      );
      if (p95 > 50 || step.errors > 0) break;
      best = r;
    }
    console.log(`capacity ${best} confirmations/s at p95 <= 50 ms`);
    const ratio = pct(app.times, 95) / pct(raw.times, 95);
    console.log(
      `confirm p95 ${pct(app.times, 95).toFixed(1)} ms, raw insert p95 ${pct(raw.times, 95).toFixed(1)} ms, ratio ${ratio.toFixed(1)}`,
    );
  } finally {
    server.stop();
    closeClient();
    await sql.end();
  }
}

run(main);
