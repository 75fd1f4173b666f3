/**
 * The growth bench's data: many shops with a year of job cards, and runner events generated in
 * SQL (INSERT … SELECT generate_series) in chunks of wheels, 100–200 events per wheel, shaped like
 * the runner's own (steps, a wrench chosen per pass, bolts confirmed with wrench, setting and
 * target). Nothing the product relies on is switched off: every foreign key, index and the
 * unique event id are checked on every row.
 * History looks as the phones make it: each event's id is a UUIDv7 of its own time (as
 * features/runner/event-id.ts makes it on the phone, random bits from gen_random_uuid), wheels start
 * spread over their shop day, and rows go in day by day in time order, so the phones of a day
 * interleave in the key's index as they do in a real shop.
 */
import { spawnSync } from 'node:child_process';
import type postgres from 'postgres';
import { STEP_IDS } from '@/features/runner/steps';

export const SHOPS = 100;
export const JOBS_PER_SHOP = 170;
/** The wheels the bench reads and saves on: shop 1's first in-progress job cards (wheel 1 to 20). */
export const MEASURED_WHEELS = 20;
const MEASURED_JOBS = MEASURED_WHEELS / 4;

/** Shops, people, a spec and a wrench per shop, job cards and wheels; a wheel list to fill from. */
export async function seedShops(sql: postgres.Sql) {
  await sql`insert into shops (name) select 'Growth shop ' || lpad(s::text, 3, '0') from generate_series(1, ${SHOPS}) s`;
  await sql`
    insert into users (shop_id, email, name, role, password_hash)
    select s.id, 'p' || i || '-' || s.id || '@bench.test', 'Person ' || i, (case when i = 1 then 'lead' else 'technician' end)::role, 'x'
    from shops s cross join generate_series(1, 5) i`;
  await sql`
    insert into wheel_specs (shop_id, name, bolt_count, bolt_thread, final_torque, torque_unit, pass_fractions, pattern_kind, max_bead_seat_pressure, running_pressure, pressure_unit)
    select id, 'Growth 32', 32, 'M10', 30, 'lbf-ft', '[0.3,0.7,1]', 'cross', 30, 14, 'psi' from shops`;
  await sql`
    insert into wrenches (shop_id, label, kind, min, max, unit, graduation, calibration_due_on, cycles_since_calibration)
    select id, 'Click 5-40', 'click', 5, 40, 'lbf-ft', 0.5, current_date + 180, 0 from shops`;
  await sql`insert into customers (shop_id, name) select s.id, 'Customer ' || i from shops s cross join generate_series(1, 50) i`;
  await sql`insert into vehicles (shop_id, customer_id, year, make, model) select shop_id, id, 2021, 'Make', 'Model' from customers`;
  // Shop 1's first job cards are in progress and assigned to its Person 2; the rest are signed off.
  await sql`
    with v as (select id, customer_id, shop_id, row_number() over (partition by shop_id order by id) - 1 as k from vehicles),
    p as (select id, shop_id, name from users)
    insert into jobs (shop_id, number, customer_id, vehicle_id, state, assignee_id, created_by_id)
    select v.shop_id, 1000 + n, v.customer_id, v.id,
      (case when n <= ${MEASURED_JOBS} then 'in_progress' else 'signed_off' end)::job_state,
      (select id from p where p.shop_id = v.shop_id and p.name = 'Person ' || (2 + n % 4)::text),
      (select id from p where p.shop_id = v.shop_id and p.name = 'Person 1')
    from generate_series(1, ${JOBS_PER_SHOP}) n join v on v.k = n % 50`;
  await sql`
    update jobs set assignee_id = (select id from users u where u.shop_id = jobs.shop_id and u.name = 'Person 2')
    where number <= ${1000 + MEASURED_JOBS}`;
  await sql`
    insert into job_wheels (shop_id, job_id, position, spec_id, tire_size, target_pressure, pressure_unit)
    select j.shop_id, j.id, p::wheel_position, s.id, '30x10R14', 14, 'psi'
    from jobs j join wheel_specs s on s.shop_id = j.shop_id cross join unnest(array['LF','RF','LR','RR']) p`;
  // The bench's own list of wheels to fill, in a fixed order (shop 1's in-progress wheels first).
  await sql`
    create table bench_wheels as
    select row_number() over (order by sh.name, j.number, w.position) as ord, w.id as wheel_id, w.job_id, w.shop_id,
      j.assignee_id as by_id, md5(j.assignee_id::text)::uuid as device_id, k.id as wrench_id,
      100 + (row_number() over (order by sh.name, j.number, w.position) * 37) % 101 as events,
      -- Each wheel starts somewhere in its shop's ten-hour day (not all a day's phones at once).
      now() - interval '2 days' - (j.number % 365) * interval '1 day'
        + ((row_number() over (order by sh.name, j.number, w.position) * 7919) % 36000) * interval '1 s' as base_at
    from job_wheels w join jobs j on j.id = w.job_id join shops sh on sh.id = w.shop_id
      join wrenches k on k.shop_id = w.shop_id`;
  await sql`create unique index on bench_wheels (ord)`;
  // The measured wheels' history is the oldest, so a table of any size holds it.
  await sql`update bench_wheels set base_at = base_at - interval '1 year' where ord <= ${MEASURED_WHEELS}`;
  // The order a big table is filled in: the oldest day first, as history accumulates (keys
  // inserted below newer ones would split pages in half and leave the key's index ~64 % full
  // instead of the ~90 % an appended history gives). A small table is filled by `ord`.
  await sql`alter table bench_wheels add column fill_ord bigint`;
  await sql`
    update bench_wheels b set fill_ord = o.n from (
      select ord, row_number() over (order by base_at, ord) as n from bench_wheels) o
    where o.ord = b.ord`;
  await sql`create unique index on bench_wheels (fill_ord)`;
  // A UUIDv7 (RFC 9562 §5.7) for a given time: its 48-bit ms timestamp over a random v4's first six
  // octets, then the version nibble 0100 → 0111 (bits 52, 53 of octet 6); the variant stays 10.
  await sql`
    create function bench_uuid7(at timestamptz) returns uuid language sql volatile as $$
      select encode(set_bit(set_bit(overlay(uuid_send(gen_random_uuid())
        placing substring(int8send(floor(extract(epoch from at) * 1000)::bigint) from 3) from 1 for 6),
        52, 1), 53, 1), 'hex')::uuid $$`;
  await sql`analyze`;
}

/** Inserts the events of wheels `from`..`to` (by `by`) in time order; answers how many rows were written. */
async function fillWheels(
  sql: postgres.Sql,
  by: 'ord' | 'fill_ord',
  from: number,
  to: number,
): Promise<number> {
  const result = await sql`
    insert into wheel_run_events (shop_id, job_id, wheel_id, client_id, type, payload, by_id, client_at, device_id, received_at)
    select w.shop_id, w.job_id, w.wheel_id, bench_uuid7(w.base_at + i * interval '5 s'),
      case when i <= 10 then 'step_done' when (i - 11) % 33 = 0 then 'wrench_chosen' else 'bolt_confirmed' end,
      case when i <= 10 then jsonb_build_object('step', (${STEP_IDS as unknown as string[]}::text[])[i], 'checklist', '[]'::jsonb)
        when (i - 11) % 33 = 0 then jsonb_build_object('pass', 1 + ((i - 11) / 33) % 3, 'wrenchId', w.wrench_id)
        else jsonb_build_object('pass', 1 + ((i - 11) / 33) % 3, 'bolt', (i - 11) % 33, 'wrenchId', w.wrench_id,
          'setting', jsonb_build_object('value', 8.5, 'unit', 'lbf-ft'), 'target', jsonb_build_object('value', 8.4, 'unit', 'lbf-ft'))
      end,
      w.by_id, w.base_at + i * interval '5 s', w.device_id, w.base_at + i * interval '5 s' + interval '1 s'
    from bench_wheels w cross join lateral generate_series(1, w.events) i
    where ${sql('w.' + by)} between ${from} and ${to}
    order by w.base_at + i * interval '5 s'`;
  return result.count;
}

/** Fills wheels in order until the table holds at least `target` rows, printing progress. */
export async function fillEvents(sql: postgres.Sql, target: number, label: string) {
  const [{ wheels }] = (await sql`select count(*)::int as wheels from bench_wheels`) as [
    { wheels: number },
  ];
  // A small table a wheel at a time, so it stops just past its target (wheels differ in size).
  const small = target <= 100_000;
  const chunk = small ? 1 : 2_000;
  // The generating backend yields the shared cores to everyone else's work (best effort).
  const [{ pid }] = (await sql`select pg_backend_pid() as pid`) as [{ pid: number }];
  spawnSync('renice', ['-n', '19', '-p', String(pid)], { stdio: 'ignore' });
  // This generating session only: a chunk's rows are sorted by time in memory, not on disk.
  await sql`set work_mem = '256MB'`;
  const started = performance.now();
  let rows = 0;
  for (let from = 1; rows < target && from <= wheels; from += chunk) {
    rows += await fillWheels(sql, small ? 'ord' : 'fill_ord', from, from + chunk - 1);
    const s = (performance.now() - started) / 1000;
    if (target > 100_000)
      console.log(
        `[growth] ${label}: ${rows.toLocaleString('en')} rows in ${s.toFixed(0)} s (${Math.round(rows / s).toLocaleString('en')} rows/s)`,
      );
  }
  await sql`vacuum analyze wheel_run_events`;
  const s = (performance.now() - started) / 1000;
  console.log(
    `[growth] ${label}: ${rows.toLocaleString('en')} events generated in ${s.toFixed(1)} s (with vacuum analyze)`,
  );
}
