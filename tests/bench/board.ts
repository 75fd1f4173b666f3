/**
 * `npm run bench:board`: one shop with 10,000 job cards (40,000 wheels) beside 9 other shops of
 * the same size; times the board's first page (state = in progress, sorted by due) through the
 * route handler of the production build over loopback, the server-rendered board page's first
 * byte (TTFB, no JavaScript, signed in as the lead), and the same SQL straight on PostgreSQL,
 * prepared as the app prepares it. The three take turns request by request over one kept-alive
 * client, so they share the machine's load. `BENCH_EXPLAIN=1` prints the board query's plan. Last lines:
 * `board p95 X ms, raw p95 Y ms, ratio Z` and `ttfb p95 X ms, raw p95 Y ms, ratio Z`.
 */
import http from 'node:http';
import postgres from 'postgres';
import { clusterUrl, recreateDatabase, startCluster } from '@/db/cluster';
import { migrateDatabase } from '@/db/migrate';
import { newSessionToken } from '../helpers/session-row';
import { pct, run, startProductionServer } from './production-server';

const DB = 'ringpass_bench';
const PORT = 3200;
const SHOPS = 10;
const JOBS_PER_SHOP = 10_000;
const RUNS = 300;
const FILTER = 'state=in_progress&sort=due&dir=asc&page=1&pageSize=25';

async function seed(sql: postgres.Sql) {
  const started = Date.now();
  for (let s = 1; s <= SHOPS; s++) {
    await sql.begin(async (tx) => {
      const [shop] = await tx`insert into shops (name) values (${`Bench shop ${s}`}) returning id`;
      const shopId = shop!.id as string;
      const people = await tx`
        insert into users (shop_id, email, name, role, password_hash)
        select ${shopId}, 'p' || i || '-shop' || ${s} || '@bench.test', 'Person ' || i, (case when i = 1 then 'lead' else 'technician' end)::role, 'x'
        from generate_series(1, 3) i returning id, role`;
      const lead = people.find((p) => p.role === 'lead')!.id as string;
      const techs = people.filter((p) => p.role === 'technician').map((p) => p.id as string);
      const [spec] = await tx`
        insert into wheel_specs (shop_id, name, bolt_count, bolt_thread, final_torque, torque_unit, pass_fractions, pattern_kind, max_bead_seat_pressure, running_pressure, pressure_unit)
        values (${shopId}, 'Bench spec', 24, 'M8', 12, 'lbf-ft', '[0.3,0.7,1]', 'cross', 30, 14, 'psi') returning id`;
      await tx`insert into customers (shop_id, name, phone) select ${shopId}, 'Customer ' || i, '555-' || i from generate_series(1, 200) i`;
      await tx`insert into vehicles (shop_id, customer_id, year, make, model) select ${shopId}, id, 2020, 'Make', 'Model ' || name from customers where shop_id = ${shopId}`;
      await tx`
        with v as (select id, customer_id, row_number() over (order by id) - 1 as k from vehicles where shop_id = ${shopId})
        insert into jobs (shop_id, number, customer_id, vehicle_id, state, assignee_id, due_at, created_by_id)
        select ${shopId}, 1000 + n, v.customer_id, v.id,
          (array['open','in_progress','awaiting_signoff','signed_off','sent_back'])[1 + n % 5]::job_state,
          (array[${techs[0]!}::uuid, ${techs[1]!}::uuid, null])[1 + n % 3],
          now() + ((n % 61) - 30) * interval '1 day' + (n % 24) * interval '1 hour',
          ${lead}
        from generate_series(1, ${JOBS_PER_SHOP}) n join v on v.k = n % 200`;
      await tx`
        insert into job_wheels (shop_id, job_id, position, spec_id, tire_size, target_pressure, pressure_unit)
        select ${shopId}, j.id, p::wheel_position, ${spec!.id}, '30x10R14', 14, 'psi'
        from jobs j cross join unnest(array['LF','RF','LR','RR']) p where j.shop_id = ${shopId}`;
    });
  }
  await sql`analyze`;
  console.log(
    `[bench] seeded ${SHOPS} shops × ${JOBS_PER_SHOP} jobs (${SHOPS * JOBS_PER_SHOP * 4} wheels) in ${((Date.now() - started) / 1000).toFixed(1)} s`,
  );
}

// Node's own client with keep-alive, as a browser reuses its connection: undici's fetch adds
// milliseconds of the generator's own CPU per request on this machine.
const agent = new http.Agent({ keepAlive: true, maxSockets: 4 });

/** Time to the first byte of the body, the whole body, and the time to its last byte. */
function get(
  url: string,
  cookie: string,
  accept: string,
): Promise<{ ttfb: number; total: number; body: string }> {
  const started = performance.now();
  return new Promise((resolve, reject) => {
    http
      .get(url, { agent, headers: { cookie, accept } }, (res) => {
        let ttfb = 0;
        let body = '';
        res.setEncoding('utf8');
        res.on('data', (chunk: string) => {
          ttfb ||= performance.now() - started;
          body += chunk;
        });
        res.on('end', () =>
          res.statusCode === 200
            ? resolve({ ttfb, total: performance.now() - started, body })
            : reject(new Error(`${url} answered ${res.statusCode}`)),
        );
      })
      .on('error', reject);
  });
}

async function main() {
  await startCluster();
  await recreateDatabase(DB);
  await migrateDatabase(clusterUrl(DB));
  const sql = postgres(clusterUrl(DB), { max: 2, onnotice: () => {} });
  await seed(sql);

  // Sign in as the lead of shop 1 by writing a session row (what sign-in does, minus the password).
  const [lead] =
    await sql`select u.id, u.shop_id from users u join shops s on s.id = u.shop_id where s.name = 'Bench shop 1' and u.role = 'lead'`;
  const session = newSessionToken();
  await sql`insert into sessions (id, user_id, expires_at, absolute_expires_at) values (${session.id}, ${lead!.id}, now() + interval '1 day', now() + interval '1 day')`;

  const server = await startProductionServer(PORT, clusterUrl(DB));
  try {
    const cookie = `ringpass_session=${session.token}`;
    const url = `http://127.0.0.1:${PORT}/api/jobs?${FILTER}`;
    const page = `http://127.0.0.1:${PORT}/board?${FILTER}`;
    const first = JSON.parse((await get(url, cookie, 'application/json')).body) as {
      total: number;
      data: { number: number }[];
    };
    console.log(`[bench] board answers ${first.data.length} rows of ${first.total} in progress`);

    // The board page's first HTML must already hold the first card (server-rendered).
    const firstNumber = first.data[0]?.number;
    if (!firstNumber || !(await get(page, cookie, 'text/html')).body.includes(String(firstNumber)))
      throw new Error(`the board page's HTML lacks job ${firstNumber}`);

    // The very SQL the handler runs (drizzle's own text), prepared as the app's client prepares
    // every statement (db/prepared-statements.ts), straight through postgres.js.
    Object.assign(process.env, {
      DATABASE_URL: server.env.DATABASE_URL,
      SMTP_URL: server.env.SMTP_URL,
    });
    const { boardQuery } = await import('@/features/jobs/server/board');
    const { boardQuerySchema } = await import('@/features/jobs/schemas');
    const member = {
      userId: lead!.id,
      shopId: lead!.shop_id,
      role: 'lead' as const,
      name: '',
      email: '',
      sessionId: session.id,
    };
    const query = boardQuery(
      member,
      boardQuerySchema.parse(Object.fromEntries(new URLSearchParams(FILTER))),
      { timeZone: 'UTC', now: new Date() },
    ).toSQL();
    const rawQuery = () => sql.unsafe(query.sql, query.params as never[], { prepare: true });

    // Page, API and raw SQL take turns, so the load other work puts on the machine falls on all
    // three alike and each ratio compares like with like.
    const ttfb: number[] = [];
    const api: number[] = [];
    const raw: number[] = [];
    for (let i = 0; i < 30 + RUNS; i++) {
      const p = await get(page, cookie, 'text/html');
      const a = await get(url, cookie, 'application/json');
      const t = performance.now();
      await rawQuery();
      if (i < 30) continue;
      raw.push(performance.now() - t);
      ttfb.push(p.ttfb);
      api.push(a.total);
    }
    if (process.env.BENCH_EXPLAIN) {
      const plan = await sql.unsafe(
        `explain (analyze, buffers) ${query.sql}`,
        query.params as never[],
      );
      console.log(plan.map((r) => r['QUERY PLAN'] as string).join('\n'));
    }
    console.log(
      `[bench] ${RUNS} requests each: board p50 ${pct(api, 50).toFixed(1)} ms, raw p50 ${pct(raw, 50).toFixed(1)} ms`,
    );
    const ratio = pct(api, 95) / pct(raw, 95);
    console.log(
      `board p95 ${pct(api, 95).toFixed(1)} ms, raw p95 ${pct(raw, 95).toFixed(1)} ms, ratio ${ratio.toFixed(1)}`,
    );
    console.log(
      `ttfb p95 ${pct(ttfb, 95).toFixed(1)} ms (p50 ${pct(ttfb, 50).toFixed(1)}), raw p95 ${pct(raw, 95).toFixed(1)} ms, ratio ${(pct(ttfb, 95) / pct(raw, 95)).toFixed(1)}`,
    );
  } finally {
    server.stop();
    agent.destroy();
    await sql.end();
  }
}

run(main);
