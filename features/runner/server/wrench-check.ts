import 'server-only';
import { and, eq, gte, inArray } from 'drizzle-orm';
import type { getDb } from '@/db';
import { wrenches, wrenchVerifications, type WheelSnapshot } from '@/db/schema';
import { CYCLE_LIMIT } from '@/features/torque-plan';
import { shopDay } from '@/features/ui/shop-time';
import { getShopSettings } from '@/server/shop/settings';
import type { ClientEvent, EventRefusal } from '../events';
import { maxPassIndex, plannedPassOf } from '../state';
import { passWrench } from '../wrench-gate';

type Db = Pick<ReturnType<typeof getDb>, 'select'>;
type Why = Omit<EventRefusal, 'index' | 'clientId'>;

const refusal = (message: string): Why => ({
  message,
  fieldErrors: { 'payload.wrenchId': [message] },
});

/** A use of a wrench on a pass: a `wrench_chosen`, or a bolt confirmation that names its wrench. */
type WrenchUse = { clientId: string; clientAt: string; pass: number; wrenchId: string };

function usesOf(events: readonly ClientEvent[]): WrenchUse[] {
  return events.flatMap((e) => {
    if (e.type === 'wrench_chosen')
      return [
        {
          clientId: e.clientId,
          clientAt: e.clientAt,
          pass: e.payload.pass,
          wrenchId: e.payload.wrenchId,
        },
      ];
    if (e.type === 'bolt_confirmed' && e.payload.wrenchId)
      return [
        {
          clientId: e.clientId,
          clientAt: e.clientAt,
          pass: e.payload.pass,
          wrenchId: e.payload.wrenchId,
        },
      ];
    return [];
  });
}

/**
 * Why each `wrench_chosen` of a batch — and each bolt confirmation naming a wrench, since the
 * phone's default wrench is used without a choice — may not be stored, by event id: a wrench that is not this
 * shop's, is out of service, overdue for calibration or at its cycle limit, does not suit the pass, or has no
 * verification the shop's policy accepts at that pass's setting at the time it was chosen. The
 * same engine rules as the phone's wrench gate (`passWrench`), judged again here.
 */
export async function wrenchRefusals(
  db: Db,
  shopId: string,
  events: readonly ClientEvent[],
  snapshot: WheelSnapshot,
): Promise<Map<string, Why>> {
  const chosen = usesOf(events);
  const out = new Map<string, Why>();
  if (!chosen.length) return out;
  const ids = [...new Set(chosen.map((e) => e.wrenchId))];
  const settings = await getShopSettings(shopId);
  const days = settings.verification.recency === 'same_day' ? 1 : settings.verification.days;
  const earliest = Math.min(...chosen.map((e) => Date.parse(e.clientAt)));
  const [rows, verifications] = await Promise.all([
    db
      .select({
        id: wrenches.id,
        label: wrenches.label,
        kind: wrenches.kind,
        min: wrenches.min,
        max: wrenches.max,
        unit: wrenches.unit,
        graduation: wrenches.graduation,
        status: wrenches.status,
        statusReason: wrenches.statusReason,
        calibrationDueOn: wrenches.calibrationDueOn,
        cyclesSinceCalibration: wrenches.cyclesSinceCalibration,
      })
      .from(wrenches)
      .where(and(eq(wrenches.shopId, shopId), inArray(wrenches.id, ids))),
    db
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
          inArray(wrenchVerifications.wrenchId, ids),
          eq(wrenchVerifications.withinTolerance, true),
          gte(wrenchVerifications.recordedAt, new Date(earliest - (days + 1) * 86_400_000)),
        ),
      ),
  ]);
  const recorded = verifications.map((v) => ({ ...v, recordedAt: v.recordedAt.toISOString() }));
  for (const e of chosen) {
    const w = rows.find((r) => r.id === e.wrenchId);
    // An added check pass is judged at the plan's check pass's target.
    const planned = plannedPassOf(snapshot.plan.passes, e.pass);
    if (!planned || e.pass > maxPassIndex(snapshot.plan.passes)) continue; // the plan check names it
    const pass = { ...planned, index: e.pass };
    if (!w) {
      out.set(e.clientId, refusal("That wrench is not in this shop's tool crib."));
      continue;
    }
    if (w.status !== 'in_service') {
      out.set(
        e.clientId,
        refusal(
          `${w.label} is out of service${w.statusReason ? ` (${w.statusReason})` : ''}; it cannot be used for a pass.`,
        ),
      );
      continue;
    }
    if (w.calibrationDueOn < shopDay(e.clientAt, settings.timeZone)) {
      out.set(
        e.clientId,
        refusal(
          `${w.label} is overdue for calibration (due ${w.calibrationDueOn}); it cannot be used for a pass.`,
        ),
      );
      continue;
    }
    // The hourly sweep takes it out of service later; until then the count itself says no.
    const cycles = w.cyclesSinceCalibration ?? 0;
    if (cycles >= CYCLE_LIMIT) {
      out.set(
        e.clientId,
        refusal(
          `${w.label} has reached ${cycles} cycles since calibration (limit ${CYCLE_LIMIT}); it cannot be used for a pass.`,
        ),
      );
      continue;
    }
    // Verifications recorded after the wrench was chosen do not count for that choice.
    const before = recorded.filter(
      (v) => Date.parse(v.recordedAt) <= Date.parse(e.clientAt) + 60_000,
    );
    const gate = passWrench({
      target: pass.target,
      wrenches: [w],
      chosenId: w.id,
      rules: {
        minFractionOfMax: settings.wrenchFloorPercent / 100,
        verification: settings.verification,
        timeZone: settings.timeZone,
      },
      verifications: before,
      now: new Date(e.clientAt),
    });
    if (!gate.choice?.ok)
      out.set(
        e.clientId,
        refusal(
          `${w.label} does not suit pass ${pass.index} (${pass.target.value} ${pass.target.unit}) at the shop's wrench floor.`,
        ),
      );
    else if (gate.verification && !gate.verification.counts)
      out.set(
        e.clientId,
        refusal(`${w.label} may not be used for pass ${pass.index}: ${gate.verification.reason}`),
      );
  }
  return out;
}
