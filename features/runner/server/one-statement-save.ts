import 'server-only';
import { sql, type SQL } from 'drizzle-orm';
import { getDb } from '@/db';
import { jobs, jobWheels, shopSettings, wheelRunEvents, wheelSpecs, wrenches } from '@/db/schema';
import { CYCLE_LIMIT } from '@/features/torque-plan';
import type { Permission } from '@/server/auth/permissions';
import { liveMemberSql } from '@/server/auth/session';
import { clampClientAt } from '../clock-window';
import { partitionEvents, type ClientEvent, type EventRefusal } from '../events';

export type SaveResult = { saved: number; duplicates: number; refused: EventRefusal[] };

/** An event with its stored time (clamped to the server's clock) and the phone's own when they differ. */
export type Timed = ClientEvent & { deviceAt: string | null };

const num = (payload: object, key: 'bolt' | 'pass') =>
  key in payload ? (payload as Record<string, number>)[key]! : null;

/**
 * The common case in one statement, without a transaction: insert the batch only if the member
 * (`who`: the session's own checks, server/auth's `liveMemberSql`) may write to this wheel now (shop,
 * in-progress job, assignee or lead, started and not submitted, spec not flagged, not sent back
 * for named steps), every bolt and pass is on the wheel's snapshot and no id is stored already —
 * all or nothing. Each bolt confirmation gets its pass's target from the snapshot. Answers how
 * many rows were new; fewer than the batch (a replay, a refusal, a first event, no live member)
 * sends the caller on to the full path.
 */
async function insertIfAllowed(who: SQL, wheelId: string, events: Timed[]): Promise<number> {
  const rows = events.map(
    (e) =>
      sql`(${e.clientId}::uuid, ${e.type}, ${JSON.stringify(e.payload)}::jsonb, ${e.clientAt}::timestamptz, ${e.deviceAt}::timestamptz, ${e.deviceId ?? null}::uuid, ${num(e.payload, 'bolt')}::int, ${num(e.payload, 'pass')}::int)`,
  );
  const inserted = await getDb().execute(sql`
    with ev (client_id, type, payload, client_at, device_at, device_id, bolt, pass) as (values ${sql.join(rows, sql`, `)}),
    m as (${who}),
    w as (
      select w.id, w.job_id, w.shop_id, m.user_id, w.snapshot, (w.snapshot->'spec'->>'boltCount')::int as bolt_count, jsonb_array_length(w.snapshot->'plan'->'passes') as passes
      from ${jobWheels} w join m on m.shop_id = w.shop_id join ${jobs} j on j.id = w.job_id join ${wheelSpecs} s on s.id = w.spec_id
      where w.id = ${wheelId} and j.state = 'in_progress' and w.submitted_at is null
        and w.snapshot is not null and s.plausibility_flag is null
        and (w.rework is null or jsonb_array_length(w.rework->'steps') = 0)
        and (m.role = 'lead' or j.assignee_id = m.user_id)
    ),
    ok as (
      select ev.*, w.id as wheel_id, w.job_id, w.shop_id, w.user_id, w.snapshot from ev cross join w
      where (ev.bolt is null or ev.bolt <= w.bolt_count) and (ev.pass is null or ev.pass <= w.passes)
        -- A replayed id (this wheel's or another's) goes to the full path, which tells them apart.
        and not exists (select 1 from ${wheelRunEvents} x where x.client_id = ev.client_id)
        -- A bolt naming a wrench takes this path only when that wrench was chosen, and so judged, for
        -- its pass, and is still usable now (in service, calibration not past due on the shop's day,
        -- under the cycle limit: it may have reached it mid-pass); otherwise the full path judges it.
        -- The choice is found through wheel_run_events_wrench_chosen_idx (db/schema/records.ts), whose
        -- predicate and pass expression these conditions repeat word for word so the planner matches it.
        and (ev.type <> 'bolt_confirmed' or ev.payload->>'wrenchId' is null or (exists (
          select 1 from ${wheelRunEvents} c join ${shopSettings} cs on cs.shop_id = c.shop_id
          where c.wheel_id = w.id and c.type = 'wrench_chosen' and c.superseded_at is null
            and (c.payload->>'pass')::int = ev.pass and c.payload->>'wrenchId' = ev.payload->>'wrenchId'
            -- Chosen the same shop day: a verification counted for the choice may not count a day later.
            and (c.client_at at time zone cs.time_zone)::date = (ev.client_at at time zone cs.time_zone)::date)
          and exists (
          select 1 from ${wrenches} k join ${shopSettings} st on st.shop_id = k.shop_id
          where k.shop_id = w.shop_id and k.id::text = ev.payload->>'wrenchId' and k.status = 'in_service'
            and k.calibration_due_on >= (ev.client_at at time zone st.time_zone)::date
            and coalesce(k.cycles_since_calibration, 0) < ${CYCLE_LIMIT})))
    ),
    ins as (
      insert into ${wheelRunEvents} (shop_id, job_id, wheel_id, client_id, type, payload, by_id, client_at, device_at, device_id)
      select ok.shop_id, ok.job_id, ok.wheel_id, ok.client_id, ok.type,
        case when ok.type = 'bolt_confirmed' then ok.payload || jsonb_build_object('target', ok.snapshot->'plan'->'passes'->(ok.pass - 1)->'target') else ok.payload end,
        ok.user_id, ok.client_at, ok.device_at, ok.device_id
      from ok where (select count(*) from ok) = ${events.length}
      on conflict (client_id) do nothing
      returning shop_id, client_id, type, payload
    ),
    -- One wrench cycle per newly stored bolt confirmation (a replayed id inserts nothing, so counts nothing).
    cycles as (
      update ${wrenches} set cycles_since_calibration = coalesce(${wrenches}.cycles_since_calibration, 0) + c.n
      from (select shop_id, (payload->>'wrenchId')::uuid as wrench_id, count(*)::int as n from ins where type = 'bolt_confirmed' and payload ? 'wrenchId' group by 1, 2) c
      where ${wrenches}.id = c.wrench_id and ${wrenches}.shop_id = c.shop_id
    )
    select client_id from ins`);
  return inserted.length;
}

/** What a batch is after the schema and the clock: its events, the refused, and whether the one-statement path may take it. */
export function prepareBatch(raw: unknown[], now: Date) {
  const parsed = partitionEvents(raw);
  const events: Timed[] = parsed.events.map(
    (e) => ({ ...e, ...clampClientAt(e.clientAt, now) }) as Timed,
  );
  const simple =
    events.length > 0 &&
    !parsed.refused.length &&
    new Set(events.map((e) => e.clientId)).size === events.length &&
    !events.some(
      (e) =>
        e.type === 'inspection_failed' || e.type === 'wrench_chosen' || e.type === 'bolt_flagged',
    );
  return { parsed, events, simple };
}

/**
 * The quick path before anyone has read the session: the whole batch in one statement that also
 * checks the session (server/auth's `liveMemberSql`: live, not due for renewal, role and
 * clearance for the route's `permission`). Null when it stored nothing: the caller goes the ordinary way
 * (session, permission, `saveWheelBatch`), which answers ended sessions, renewals, refusals and
 * replays as before. Only a race (another request storing one of these ids between this
 * statement's read and its insert) leaves part of a batch stored here; the ordinary way then
 * counts those rows as duplicates, which the phone treats as saved.
 */
export async function saveWheelBatchForSession(
  sessionId: string,
  permission: Permission,
  wheelId: string,
  raw: unknown[],
  now = new Date(),
): Promise<SaveResult | null> {
  const { events, simple } = prepareBatch(raw, now);
  if (!simple) return null;
  const saved = await insertIfAllowed(
    liveMemberSql(sessionId, permission, now.getTime()),
    wheelId,
    events,
  );
  return saved === events.length ? { saved, duplicates: 0, refused: [] } : null;
}
