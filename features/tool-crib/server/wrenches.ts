import 'server-only';
import { and, asc, desc, eq, gte, inArray, not, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import {
  users,
  wrenches,
  wrenchStatusEvents,
  wrenchVerifications,
  type WrenchRow,
} from '@/db/schema';
import {
  assertWrench,
  CYCLE_LIMIT,
  TorquePlanError,
  verifyReading,
  type RecordedVerification,
  type Wrench,
} from '@/features/torque-plan';
import { shopDay } from '@/features/ui/shop-time';
import type { Member } from '@/server/auth/session';
import { DomainError, notFound } from '@/server/errors';
import { getShopSettings } from '@/server/shop/settings';
import type { VerificationInput, WrenchInput } from '../schemas';

export type CribWrenchDto = Omit<WrenchRow, 'shopId' | 'createdAt'>;

const storedColumns = {
  id: wrenches.id,
  label: wrenches.label,
  kind: wrenches.kind,
  min: wrenches.min,
  max: wrenches.max,
  unit: wrenches.unit,
  graduation: wrenches.graduation,
  serial: wrenches.serial,
  calibrationDueOn: wrenches.calibrationDueOn,
  cyclesSinceCalibration: wrenches.cyclesSinceCalibration,
  status: wrenches.status,
  statusReason: wrenches.statusReason,
};

/** Calibration past due on the shop's calendar, or the cycle count reached. */
const overdueOn = (today: string) =>
  sql`(${wrenches.calibrationDueOn} < ${today}::date or coalesce(${wrenches.cyclesSinceCalibration}, 0) >= ${CYCLE_LIMIT})`;

const overdueReason = (today: string) =>
  sql<string>`case when ${wrenches.calibrationDueOn} < ${today}::date then 'Calibration overdue (was due ' || ${wrenches.calibrationDueOn}::text || ')' else 'Cycle count reached ${sql.raw(String(CYCLE_LIMIT))}: recalibrate' end`;

/**
 * The crib as people see it: a wrench whose calibration fell due since the last sweep (the hourly
 * queue job) already reads as out of service, without a write on every read.
 */
const columns = (today: string) => ({
  ...storedColumns,
  status: sql<
    WrenchRow['status']
  >`case when ${wrenches.status} = 'in_service' and ${overdueOn(today)} then 'out_of_service'::wrench_status else ${wrenches.status} end`,
  statusReason: sql<string>`case when ${wrenches.status} = 'in_service' and ${overdueOn(today)} then ${overdueReason(today)} else ${wrenches.statusReason} end`,
});

function checkWithEngine(input: WrenchInput) {
  try {
    assertWrench({ id: input.label, ...input });
  } catch (error) {
    if (error instanceof TorquePlanError) {
      const field = (error.field ?? '').split('.').pop() ?? 'label';
      throw new DomainError('invalid', error.message, { [field]: [error.message] });
    }
    throw error;
  }
}

/**
 * The shop's calendar day now ('YYYY-MM-DD'): a wrench due "today" is good until the shop's own
 * midnight, not the database server's.
 */
async function shopToday(shopId: string, now = new Date()): Promise<string> {
  return shopDay(now, (await getShopSettings(shopId)).timeZone);
}

/**
 * Puts wrenches whose calibration is overdue (or whose cycle count reached the limit) out of
 * service, with an event each. Run by the hourly queue job for every shop (`sweepAllShops`); reads
 * in between compute the same verdict without writing (`columns`, `wrenchesForEngine`).
 */
export async function sweepOverdue(shopId: string, now = new Date()): Promise<void> {
  const db = getDb();
  const today = await shopToday(shopId, now);
  const overdue = await db
    .update(wrenches)
    .set({
      status: 'out_of_service',
      statusReason: overdueReason(today),
    })
    .where(and(eq(wrenches.shopId, shopId), eq(wrenches.status, 'in_service'), overdueOn(today)))
    .returning({ id: wrenches.id, reason: wrenches.statusReason });
  if (overdue.length) {
    await db.insert(wrenchStatusEvents).values(
      overdue.map((w) => ({
        shopId,
        wrenchId: w.id,
        status: 'out_of_service' as const,
        reason: w.reason,
      })),
    );
  }
}

/** The hourly sweep: every shop, each on its own calendar. */
export async function sweepAllShops(now = new Date()): Promise<void> {
  const shopIds = await getDb().selectDistinct({ shopId: wrenches.shopId }).from(wrenches);
  for (const { shopId } of shopIds) await sweepOverdue(shopId, now);
}

export async function listWrenches(shopId: string): Promise<CribWrenchDto[]> {
  return getDb()
    .select(columns(await shopToday(shopId)))
    .from(wrenches)
    .where(eq(wrenches.shopId, shopId))
    .orderBy(asc(wrenches.label));
}

export async function getWrench(shopId: string, wrenchId: string): Promise<CribWrenchDto> {
  const [row] = await getDb()
    .select(columns(await shopToday(shopId)))
    .from(wrenches)
    .where(and(eq(wrenches.shopId, shopId), eq(wrenches.id, wrenchId)));
  if (!row) throw notFound('That wrench');
  return row;
}

/** In-service wrenches as the engine takes them (optionally only these ids), with their labels. */
export async function wrenchesForEngine(
  shopId: string,
  ids?: string[],
): Promise<(Wrench & { label: string })[]> {
  const today = await shopToday(shopId);
  const rows = await getDb()
    .select({
      id: wrenches.id,
      label: wrenches.label,
      min: wrenches.min,
      max: wrenches.max,
      unit: wrenches.unit,
      graduation: wrenches.graduation,
      kind: wrenches.kind,
    })
    .from(wrenches)
    .where(
      and(
        eq(wrenches.shopId, shopId),
        eq(wrenches.status, 'in_service'),
        not(overdueOn(today)),
        ids ? inArray(wrenches.id, ids) : undefined,
      ),
    );
  return rows;
}

export async function createWrench(actor: Member, input: WrenchInput): Promise<CribWrenchDto> {
  checkWithEngine(input);
  const [row] = await getDb()
    .insert(wrenches)
    .values({
      ...input,
      cyclesSinceCalibration: input.cyclesSinceCalibration ?? null,
      shopId: actor.shopId,
    })
    .returning({ id: wrenches.id });
  // Entered already overdue (date or cycles): out of service now, not at the next hourly sweep.
  await sweepOverdue(actor.shopId);
  return getWrench(actor.shopId, row!.id);
}

export async function updateWrench(
  actor: Member,
  wrenchId: string,
  input: WrenchInput,
): Promise<CribWrenchDto> {
  checkWithEngine(input);
  const [row] = await getDb()
    .update(wrenches)
    .set({ ...input, cyclesSinceCalibration: input.cyclesSinceCalibration ?? null })
    .where(and(eq(wrenches.shopId, actor.shopId), eq(wrenches.id, wrenchId)))
    .returning({ id: wrenches.id });
  if (!row) throw notFound('That wrench');
  // A lead's edit that makes it overdue takes effect at once, not at the next hourly sweep.
  await sweepOverdue(actor.shopId);
  return getWrench(actor.shopId, wrenchId);
}

/**
 * Records a reading against a reference, judged by the engine. Out of tolerance puts the wrench
 * out of service at once; a good reading never puts it back (only a lead does, with a reason).
 */
export async function recordVerification(
  actor: Member,
  wrenchId: string,
  input: VerificationInput,
) {
  const wrench = await getWrench(actor.shopId, wrenchId);
  const verdict = verifyReading(
    { ...wrench },
    { value: input.referenceValue, unit: input.unit },
    { value: input.readingValue, unit: input.unit },
  );
  return getDb().transaction(async (tx) => {
    const [row] = await tx
      .insert(wrenchVerifications)
      .values({
        shopId: actor.shopId,
        wrenchId,
        ...input,
        deviationPct: verdict.deviationPct,
        tolerancePct: verdict.tolerancePct,
        withinTolerance: verdict.withinTolerance,
        recordedById: actor.userId,
      })
      .returning({ id: wrenchVerifications.id, recordedAt: wrenchVerifications.recordedAt });
    if (!verdict.withinTolerance && wrench.status === 'in_service') {
      const reason = `Verification out of tolerance: ${verdict.deviationPct > 0 ? '+' : ''}${verdict.deviationPct.toFixed(1)} % (allowed ±${verdict.tolerancePct} %)`;
      await tx
        .update(wrenches)
        .set({ status: 'out_of_service', statusReason: reason })
        .where(and(eq(wrenches.shopId, actor.shopId), eq(wrenches.id, wrenchId)));
      await tx.insert(wrenchStatusEvents).values({
        shopId: actor.shopId,
        wrenchId,
        status: 'out_of_service',
        reason,
        byId: actor.userId,
      });
    }
    return { id: row!.id, recordedAt: row!.recordedAt.toISOString(), ...verdict };
  });
}

/** A lead puts an out-of-service wrench back, with a reason; not while its calibration is overdue. */
export async function clearWrench(
  actor: Member,
  wrenchId: string,
  reason: string,
): Promise<CribWrenchDto> {
  const wrench = await getWrench(actor.shopId, wrenchId);
  if (wrench.status === 'in_service')
    throw new DomainError('conflict', 'This wrench is already in service.');
  const [overdue] = await getDb()
    .select({
      yes: sql<boolean>`${wrenches.calibrationDueOn} < ${await shopToday(actor.shopId)}::date or coalesce(${wrenches.cyclesSinceCalibration}, 0) >= ${CYCLE_LIMIT}`,
    })
    .from(wrenches)
    .where(and(eq(wrenches.shopId, actor.shopId), eq(wrenches.id, wrenchId)));
  if (overdue?.yes) {
    const message =
      'Its calibration is overdue: record the new calibration (due date, cycles) before putting it back in service.';
    throw new DomainError('conflict', message, { reason: [message] });
  }
  await getDb().transaction(async (tx) => {
    await tx
      .update(wrenches)
      .set({ status: 'in_service', statusReason: '' })
      .where(and(eq(wrenches.shopId, actor.shopId), eq(wrenches.id, wrenchId)));
    await tx
      .insert(wrenchStatusEvents)
      .values({ shopId: actor.shopId, wrenchId, status: 'in_service', reason, byId: actor.userId });
  });
  return getWrench(actor.shopId, wrenchId);
}

export type WrenchHistoryEntry =
  | {
      type: 'verification';
      at: string;
      by: string;
      referenceValue: number;
      readingValue: number;
      unit: WrenchRow['unit'];
      deviationPct: number;
      tolerancePct: number;
      withinTolerance: boolean;
    }
  | { type: 'status'; at: string; by: string | null; status: WrenchRow['status']; reason: string };

/** Verifications and status changes, newest first. */
export async function wrenchHistory(
  shopId: string,
  wrenchId: string,
): Promise<WrenchHistoryEntry[]> {
  await getWrench(shopId, wrenchId);
  const db = getDb();
  const [checks, events] = await Promise.all([
    db
      .select({
        at: wrenchVerifications.recordedAt,
        by: users.name,
        referenceValue: wrenchVerifications.referenceValue,
        readingValue: wrenchVerifications.readingValue,
        unit: wrenchVerifications.unit,
        deviationPct: wrenchVerifications.deviationPct,
        tolerancePct: wrenchVerifications.tolerancePct,
        withinTolerance: wrenchVerifications.withinTolerance,
      })
      .from(wrenchVerifications)
      .innerJoin(users, eq(users.id, wrenchVerifications.recordedById))
      .where(
        and(eq(wrenchVerifications.shopId, shopId), eq(wrenchVerifications.wrenchId, wrenchId)),
      )
      .orderBy(desc(wrenchVerifications.recordedAt))
      .limit(200),
    db
      .select({
        at: wrenchStatusEvents.at,
        by: users.name,
        status: wrenchStatusEvents.status,
        reason: wrenchStatusEvents.reason,
      })
      .from(wrenchStatusEvents)
      .leftJoin(users, eq(users.id, wrenchStatusEvents.byId))
      .where(and(eq(wrenchStatusEvents.shopId, shopId), eq(wrenchStatusEvents.wrenchId, wrenchId)))
      .orderBy(desc(wrenchStatusEvents.at))
      .limit(200),
  ]);
  const entries: WrenchHistoryEntry[] = [
    ...checks.map((c) => ({ type: 'verification' as const, ...c, at: c.at.toISOString() })),
    ...events.map((e) => ({ type: 'status' as const, ...e, at: e.at.toISOString() })),
  ];
  return entries.sort((a, b) => b.at.localeCompare(a.at) || (a.type === 'status' ? -1 : 1));
}

/**
 * Passing verifications recent enough that the shop's policy might count them (the engine's
 * `verificationFor` decides, per pass setting, on the shop's calendar). `days` shop days back,
 * plus one day of margin for any time zone's offset; newest first.
 */
export async function recentPassingVerifications(
  shopId: string,
  days: number,
  now = new Date(),
): Promise<RecordedVerification[]> {
  const since = new Date(now.getTime() - (Math.max(1, days) + 1) * 86_400_000);
  const rows = await getDb()
    .select({
      wrenchId: wrenchVerifications.wrenchId,
      recordedAt: wrenchVerifications.recordedAt,
      referenceValue: wrenchVerifications.referenceValue,
      unit: wrenchVerifications.unit,
    })
    .from(wrenchVerifications)
    .where(
      and(
        eq(wrenchVerifications.shopId, shopId),
        eq(wrenchVerifications.withinTolerance, true),
        gte(wrenchVerifications.recordedAt, since),
      ),
    )
    .orderBy(desc(wrenchVerifications.recordedAt))
    .limit(1000);
  return rows.map((r) => ({ ...r, recordedAt: r.recordedAt.toISOString() }));
}
