/**
 * `npm run bench:runner`: the runner's save path under load, against the production build over
 * loopback.
 * (a) 50 technicians, each confirming a bolt every 2 s (open arrivals, about 25 a second) for 30 s
 *     through the runner's save action (saveWheelEvents), signed in; in the same run, single-row inserts straight
 *     into PostgreSQL at the same rate.
 * (b) capacity: the rate rises by half, 30 s per step, while the p95 stays at or under 50 ms.
 * Last two lines: `capacity N confirmations/s at p95 <= 50 ms` and
 * `confirm p95 X ms, raw insert p95 Y ms, ratio Z`.
 */
import { randomUUID } from 'node:crypto';
import http from 'node:http';
import path from 'node:path';
import postgres from 'postgres';
import { clusterUrl, recreateDatabase, startCluster } from '@/db/cluster';
import { migrateDatabase } from '@/db/migrate';
import { serverActionId } from '../helpers/next-build';
import { newSessionToken } from '../helpers/session-row';
import { ROOT } from '../helpers/test-services';
import { pct, run, startProductionServer } from './production-server';

const DB = 'ringpass_bench_runner';
const PORT = 3201;
const TECHS = 50;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 30);
const BASE = `http://127.0.0.1:${PORT}`;

type Tech = {
  cookie: string;
  wheelId: string;
  jobId: string;
  userId: string;
  shopId: string;
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
    const session = newSessionToken();
    await sql`insert into sessions (id, user_id, expires_at, absolute_expires_at) values (${session.id}, ${u!.id}, now() + interval '1 day', now() + interval '1 day')`;
    techs.push({
      cookie: `ringpass_session=${session.token}`,
      wheelId: wheel!.id,
      jobId: job!.id,
      userId: u!.id,
      shopId,
      n: 0,
    });
  }
  return techs;
}

function confirmEvents(t: Tech) {
  const k = t.n++;
  return [
    {
      type: 'bolt_confirmed',
      payload: { pass: 1 + (Math.floor(k / 32) % 4), bolt: 1 + (k % 32) },
      clientId: randomUUID(),
      clientAt: new Date().toISOString(),
    },
  ];
}

// A light HTTP client with keep-alive: undici's fetch added 2-4 ms of the generator's own CPU to
// every round trip on this machine, which is not the server's time.
const agent = new http.Agent({ keepAlive: true, maxSockets: 256 });
function post(
  path: string,
  headers: Record<string, string>,
  body: string,
): Promise<{ status: number; text: string }> {
  return new Promise((resolve, reject) => {
    const req = http.request(`${BASE}${path}`, { method: 'POST', headers, agent }, (res) => {
      let text = '';
      res.setEncoding('utf8');
      res.on('data', (chunk: string) => (text += chunk));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, text }));
    });
    req.on('error', reject);
    req.end(body);
  });
}

/**
 * One confirmation as the runner sends it: its server action, posted to the runner page with the
 * action's id from the build, arguments encoded as React encodes plain JSON (prev state, input).
 */
let actionId = '';
async function confirm(t: Tech): Promise<number> {
  const started = performance.now();
  const body = JSON.stringify([null, { wheelId: t.wheelId, events: confirmEvents(t) }]);
  const headers = {
    cookie: t.cookie,
    origin: BASE,
    'content-type': 'text/plain;charset=UTF-8',
    accept: 'text/x-component',
    'next-action': actionId,
  };
  const res = await post(`/jobs/${t.jobId}/wheels/${t.wheelId}/run`, headers, body);
  if (res.status !== 200 || !res.text.includes('{"ok":true,'))
    throw new Error(`confirm answered ${res.status}: ${res.text.slice(0, 200)}`);
  return performance.now() - started;
}

async function rawInsert(sql: postgres.Sql, t: Tech): Promise<number> {
  const started = performance.now();
  await sql`insert into wheel_run_events (shop_id, job_id, wheel_id, client_id, type, payload, by_id, client_at) values (${t.shopId}, ${t.jobId}, ${t.wheelId}, ${randomUUID()}, 'bench_raw', ${sql.json({ pass: 1, bolt: 1 })}, ${t.userId}, now())`;
  return performance.now() - started;
}

/** Open arrivals: requests start on schedule whether or not earlier ones have finished. */
async function load(rate: number, seconds: number, run: (i: number) => Promise<number>) {
  const times: number[] = [];
  let errors = 0;
  const inflight: Promise<void>[] = [];
  const start = performance.now();
  const total = Math.round(rate * seconds);
  for (let i = 0; i < total; i++) {
    const due = start + (i * 1000) / rate;
    const wait = due - performance.now();
    if (wait > 1) await new Promise((r) => setTimeout(r, wait));
    inflight.push(
      run(i).then(
        (ms) => void times.push(ms),
        () => void errors++,
      ),
    );
  }
  await Promise.all(inflight);
  return { times, errors };
}

async function main() {
  await startCluster();
  await recreateDatabase(DB);
  await migrateDatabase(clusterUrl(DB));
  const sql = postgres(clusterUrl(DB), { max: 10, onnotice: () => {} });
  const techs = await seed(sql);
  const server = await startProductionServer(PORT, clusterUrl(DB));
  actionId = serverActionId(path.join(ROOT, server.distDir), 'saveWheelEvents');
  await confirm(techs[0]!); // fails loudly when the action path is wrong
  try {
    await load(25, 4, (i) => confirm(techs[i % TECHS]!)); // warm-up

    // (a) 50 technicians at one bolt every 2 s each, beside raw inserts at the same rate.
    const rate = TECHS / 2;
    const [app, raw] = await Promise.all([
      load(rate, SECONDS, (i) => confirm(techs[i % TECHS]!)),
      load(rate, SECONDS, (i) => rawInsert(sql, techs[i % TECHS]!)),
    ]);
    console.log(
      `[bench] (a) ${app.times.length} confirmations in ${SECONDS} s (${app.errors} errors): p50 ${pct(app.times, 50).toFixed(1)} ms, p95 ${pct(app.times, 95).toFixed(1)} ms; raw insert p50 ${pct(raw.times, 50).toFixed(2)} ms, p95 ${pct(raw.times, 95).toFixed(2)} ms`,
    );

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
    agent.destroy();
    await sql.end();
  }
}

run(main);
