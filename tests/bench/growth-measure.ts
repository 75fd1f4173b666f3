/**
 * The growth bench's operations, each through the product's own code against one database:
 * `read` (what GET /api/wheels/:id/events does: loadWheel, assertMayRun, listEvents, reduceRun),
 * `confirm` (a new bolt confirmation naming its wrench, as the runner's action saves it: the quick
 * statement with the session, else saveWheelBatch) and `replay` (the
 * same confirmation sent again, as a phone does when an answer was lost: the save path's full
 * transaction). Event ids are made as the phone makes them (UUIDv7, features/runner/event-id.ts).
 */
import { newEventId } from '@/features/runner/event-id';
import type { ClientEvent } from '@/features/runner/events';
import { saveWheelBatchForSession } from '@/features/runner/server/one-statement-save';
import { saveWheelBatch } from '@/features/runner/server/save-events';
import { assertMayRun, listEvents, loadWheel, planFor } from '@/features/runner/server/run';
import { reduceRun } from '@/features/runner/state';
import type { Member } from '@/server/auth/session';
import { newSessionToken } from '../helpers/session-row';
import type { CapturingDb } from './growth-db';
import { MEASURED_WHEELS } from './growth-seed';

type Setup = { member: Member; wrenchId: string; reads: string[]; saves: string[] };
const setups = new WeakMap<CapturingDb, Setup>();

const noStart = () => Promise.reject(new Error('the measured job cards are already in progress'));

/** Shop 1's technician, wrench and measured wheels; each wheel's snapshot taken as the runner would. */
async function setup(db: CapturingDb): Promise<Setup> {
  const known = setups.get(db);
  if (known) return known;
  const [who] = await db.sql`
    select u.id, u.shop_id, k.id as wrench_id from users u join shops s on s.id = u.shop_id
    join wrenches k on k.shop_id = s.id where s.name = 'Growth shop 001' and u.name = 'Person 2'`;
  const wheels = await db.sql`
    select wheel_id from bench_wheels where ord <= ${MEASURED_WHEELS} order by ord`;
  // A verification today at pass 1's setting, and a wrench far from its cycle limit, on every run.
  await db.sql`update wrenches set cycles_since_calibration = 0 where id = ${who!.wrench_id as string}`;
  await db.sql`
    insert into wrench_verifications (shop_id, wrench_id, reference_value, reading_value, unit, deviation_pct, tolerance_pct, within_tolerance, recorded_by_id)
    values (${who!.shop_id as string}, ${who!.wrench_id as string}, 9, 9.1, 'lbf-ft', 1.1, 4, true, ${who!.id as string})`;
  // A live session, so a confirmation takes the action's quick statement, session check included.
  const session = newSessionToken();
  await db.sql`
    insert into sessions (id, user_id, expires_at, absolute_expires_at)
    values (${session.id}, ${who!.id as string}, now() + interval '1 day', now() + interval '1 day')`;
  const member: Member = {
    userId: who!.id as string,
    shopId: who!.shop_id as string,
    role: 'technician',
    name: 'Person 2',
    email: '',
    sessionId: session.id,
  };
  const ids = wheels.map((w) => w.wheel_id as string);
  const wrenchId = who!.wrench_id as string;
  db.use();
  for (const wheelId of ids) {
    const ctx = await loadWheel(member.shopId, wheelId);
    if (!ctx.wheel.snapshot) await save(member, wheelId, stepDone());
  }
  const half = ids.length / 2;
  // The saved-on wheels' generated choices are months old, and the quick statement takes a bolt
  // naming a wrench only when that wrench was chosen for its pass the same shop day: without a
  // choice today every measured confirmation would be handed on to the full path.
  for (const wheelId of ids.slice(half)) await save(member, wheelId, chosen(wrenchId));
  const made = { member, wrenchId, reads: ids.slice(0, half), saves: ids.slice(half) };
  setups.set(db, made);
  return made;
}

const stepDone = (): ClientEvent => ({
  clientId: newEventId(),
  clientAt: new Date().toISOString(),
  type: 'step_done',
  payload: { step: 'safety', checklist: [] },
});

const chosen = (wrenchId: string): ClientEvent => ({
  clientId: newEventId(),
  clientAt: new Date().toISOString(),
  type: 'wrench_chosen',
  payload: { pass: 1, wrenchId },
});

// Without a wrench (as older phones sent it) the statement updates no wrench row, so parallel saves
// measure the database's inserts and commits rather than one shared wrench's row lock.
const confirmation = (k: number, wrenchId?: string): ClientEvent => ({
  clientId: newEventId(),
  clientAt: new Date().toISOString(),
  type: 'bolt_confirmed',
  payload: {
    pass: 1,
    bolt: 1 + (k % 32),
    ...(wrenchId ? { wrenchId, setting: { value: 9, unit: 'lbf-ft' as const } } : {}),
  },
});

/** What the runner's save handler does: the quick statement first, the full path when it stores nothing. */
async function save(member: Member, wheelId: string, event: ClientEvent) {
  const quick = await saveWheelBatchForSession(member.sessionId, 'jobs.run', wheelId, [event]);
  const result = quick ?? (await saveWheelBatch(member, wheelId, [event], noStart));
  if (result.refused.length) throw new Error(`refused: ${result.refused[0]!.message}`);
  return { ...result, quick: quick !== null };
}

async function read(s: Setup, wheelId: string) {
  const ctx = await loadWheel(s.member.shopId, wheelId);
  assertMayRun(s.member, ctx);
  const events = await listEvents(s.member.shopId, wheelId);
  const state = reduceRun(planFor(ctx), events);
  if (events.length < 100 || !state)
    throw new Error(`wheel ${wheelId} has ${events.length} events`);
}

const timed = async (xs: number[], body: () => Promise<unknown>) => {
  const started = performance.now();
  await body();
  xs.push(performance.now() - started);
};

/** `n` of each operation against `db`; answers the times in ms. */
export async function measure(db: CapturingDb, n: number) {
  const s = await setup(db);
  db.use();
  const out = { read: [] as number[], confirm: [] as number[], replay: [] as number[] };
  for (let i = 0; i < n; i++) {
    const wheelId = s.saves[i % s.saves.length]!;
    await timed(out.read, () => read(s, s.reads[i % s.reads.length]!));
    const event = confirmation(i, s.wrenchId);
    await timed(out.confirm, async () => {
      const saved = await save(s.member, wheelId, event);
      if (saved.saved !== 1) throw new Error('not saved');
      // The figure is the quick statement's: a confirmation handed on would measure the full path.
      if (!saved.quick) throw new Error('the quick statement handed a plain confirmation on');
    });
    await timed(out.replay, async () => {
      if ((await save(s.member, wheelId, event)).duplicates !== 1) throw new Error('not a replay');
    });
  }
  return out;
}

/** Confirmations per second with `parallel` saves in flight for `seconds` (no wrench named). */
export async function throughput(db: CapturingDb, seconds: number, parallel: number) {
  const s = await setup(db);
  db.use();
  const end = performance.now() + seconds * 1000;
  let done = 0;
  await Promise.all(
    Array.from({ length: parallel }, async (_, worker) => {
      for (let k = 0; performance.now() < end; k++) {
        await save(s.member, s.saves[(worker + k) % s.saves.length]!, confirmation(k));
        done++;
      }
    }),
  );
  return done / seconds;
}

/** The statements one operation sends, for EXPLAIN. */
export async function captureOne(db: CapturingDb, op: 'read' | 'confirm' | 'replay') {
  const s = await setup(db);
  db.use();
  const wheelId = s.saves[0]!;
  const event = confirmation(7, s.wrenchId);
  if (op === 'read') return db.capture(() => read(s, s.reads[0]!));
  if (op === 'confirm') {
    const statements = await db.capture(async () => {
      if (!(await save(s.member, wheelId, event)).quick) throw new Error('handed on, not quick');
    });
    // Gone again, so the explained insert stores it (then rolls back) instead of finding it there.
    await db.sql`delete from wheel_run_events where client_id = ${event.clientId}`;
    return statements;
  }
  await save(s.member, wheelId, event);
  return db.capture(() => save(s.member, wheelId, event));
}
