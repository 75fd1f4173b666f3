import 'server-only';
import { and, asc, eq, gte, inArray, lte } from 'drizzle-orm';
import { getDb } from '@/db';
import {
  customers,
  jobs,
  jobWheels,
  refusedRunEvents,
  users,
  vehicles,
  wheelPhotos,
  wheelRunEvents,
  wheelSpecs,
  wrenches,
  wrenchStatusEvents,
  wrenchVerifications,
} from '@/db/schema';
import type { RecordedVerification } from '@/features/torque-plan';
import { notFound } from '@/server/errors';
import { getShopSettings } from '@/server/shop/settings';
import { jobAnomalies, wrenchUses, type WrenchUse } from '../anomalies';
import { wheelBasis, type WheelBasis } from '../plan-source';
import { wheelRecord, type WheelRecord } from '../record';
import type {
  Anomaly,
  JobReviewInput,
  RefusedEvent,
  ReviewEvent,
  ReviewSettings,
  ReviewStep,
  ReviewWrench,
  WheelReviewInput,
} from '../types';

/**
 * What the review needs from other features, handed in where they meet (app/): the runner's steps
 * and required photos, the jobs feature's axle check.
 */
export type ReviewSources = {
  stepsFor: (job: { dismount: boolean; reinstall: boolean }) => ReviewStep[];
  requiredPhotos: readonly string[];
  axleWarnings: (wheels: { position: string; tireSize: string }[]) => string[];
};

export type ReviewPhoto = { id: string; kind: string; note: string; url: string; at: string };
export type WheelReview = Omit<WheelBasis, 'plan'> & {
  id: string;
  position: string;
  tireSize: string;
  submittedAt: string | null;
  flaggedReason: string | null;
  rework: { note: string; steps: string[]; at: string } | null;
  plan: WheelBasis['plan'];
  record: WheelRecord;
  /** Per pass (by index), each wrench used with its setting and the verification that counted. */
  wrenchUses: Record<number, WrenchUse[]>;
  photos: ReviewPhoto[];
  refused: RefusedEvent[];
};
export type JobReview = {
  job: {
    id: string;
    number: number;
    state: string;
    customerName: string;
    vehicleLabel: string;
    vin: string | null;
    assignee: { id: string; name: string } | null;
    dismount: boolean;
    reinstall: boolean;
  };
  timeZone: string;
  people: Record<string, string>;
  wheels: WheelReview[];
  anomalies: Anomaly[];
};

const DAY_MS = 86_400_000;

/** Everything a lead reads to decide on one job card, with its anomalies; another shop's job is not found. */
export async function getJobReview(
  shopId: string,
  jobId: string,
  sources: ReviewSources,
): Promise<JobReview> {
  const db = getDb();
  const [job] = await db
    .select({
      id: jobs.id,
      number: jobs.number,
      state: jobs.state,
      assigneeId: jobs.assigneeId,
      dismount: jobs.dismount,
      reinstall: jobs.reinstall,
      customerName: customers.name,
      year: vehicles.year,
      make: vehicles.make,
      model: vehicles.model,
      description: vehicles.description,
      vin: vehicles.vin,
      vinCheckOverridden: vehicles.vinCheckOverridden,
    })
    .from(jobs)
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(vehicles, eq(vehicles.id, jobs.vehicleId))
    .where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)));
  if (!job) throw notFound('That job card');

  const [settings, wheelRows, eventRows, photoRows, refusedRows, crib] = await Promise.all([
    getShopSettings(shopId),
    db
      .select({
        wheel: {
          id: jobWheels.id,
          position: jobWheels.position,
          tireSize: jobWheels.tireSize,
          targetPressure: jobWheels.targetPressure,
          pressureUnit: jobWheels.pressureUnit,
          submittedAt: jobWheels.submittedAt,
          flaggedReason: jobWheels.flaggedReason,
          snapshot: jobWheels.snapshot,
          rework: jobWheels.rework,
        },
        spec: {
          name: wheelSpecs.name,
          boltCount: wheelSpecs.boltCount,
          patternKind: wheelSpecs.patternKind,
          skipStep: wheelSpecs.skipStep,
          finalTorque: wheelSpecs.finalTorque,
          torqueUnit: wheelSpecs.torqueUnit,
          passFractions: wheelSpecs.passFractions,
          checkPass: wheelSpecs.checkPass,
          maxBeadSeatPressure: wheelSpecs.maxBeadSeatPressure,
          pressureUnit: wheelSpecs.pressureUnit,
        },
      })
      .from(jobWheels)
      .innerJoin(wheelSpecs, eq(wheelSpecs.id, jobWheels.specId))
      .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.jobId, jobId))),
    db
      .select({
        wheelId: wheelRunEvents.wheelId,
        clientId: wheelRunEvents.clientId,
        type: wheelRunEvents.type,
        payload: wheelRunEvents.payload,
        byId: wheelRunEvents.byId,
        deviceId: wheelRunEvents.deviceId,
        clientAt: wheelRunEvents.clientAt,
        receivedAt: wheelRunEvents.receivedAt,
        supersededAt: wheelRunEvents.supersededAt,
      })
      .from(wheelRunEvents)
      .where(and(eq(wheelRunEvents.shopId, shopId), eq(wheelRunEvents.jobId, jobId)))
      .orderBy(asc(wheelRunEvents.clientAt)),
    db
      .select({
        id: wheelPhotos.id,
        wheelId: wheelPhotos.wheelId,
        kind: wheelPhotos.kind,
        note: wheelPhotos.note,
        createdAt: wheelPhotos.createdAt,
      })
      .from(wheelPhotos)
      .where(and(eq(wheelPhotos.shopId, shopId), eq(wheelPhotos.jobId, jobId))),
    db
      .select({
        wheelId: refusedRunEvents.wheelId,
        clientId: refusedRunEvents.clientId,
        raw: refusedRunEvents.raw,
        reason: refusedRunEvents.reason,
        at: refusedRunEvents.at,
      })
      .from(refusedRunEvents)
      .where(and(eq(refusedRunEvents.shopId, shopId), eq(refusedRunEvents.jobId, jobId))),
    db
      .select({
        id: wrenches.id,
        label: wrenches.label,
        kind: wrenches.kind,
        min: wrenches.min,
        max: wrenches.max,
        unit: wrenches.unit,
        graduation: wrenches.graduation,
        calibrationDueOn: wrenches.calibrationDueOn,
      })
      .from(wrenches)
      .where(eq(wrenches.shopId, shopId)),
  ]);

  const events: (ReviewEvent & { wheelId: string })[] = eventRows.map((e) => ({
    wheelId: e.wheelId,
    clientId: e.clientId,
    type: e.type,
    payload: e.payload,
    byId: e.byId,
    deviceId: e.deviceId,
    clientAt: e.clientAt.toISOString(),
    receivedAt: e.receivedAt.toISOString(),
    superseded: e.supersededAt !== null,
  }));
  const usedWrenchIds = [
    ...new Set(
      events.map((e) => e.payload.wrenchId).filter((id): id is string => typeof id === 'string'),
    ),
  ].filter((id) => crib.some((w) => w.id === id));
  const [verifications, statusRows] = await wrenchHistory(
    shopId,
    usedWrenchIds,
    events,
    settings.verification.days,
  );
  const wrenchList: ReviewWrench[] = crib
    .filter((w) => usedWrenchIds.includes(w.id))
    .map((w) => ({
      ...w,
      statusHistory: statusRows
        .filter((s) => s.wrenchId === w.id)
        .map((s) => ({ status: s.status, reason: s.reason, at: s.at.toISOString() })),
    }));

  const steps = sources.stepsFor(job);
  const reviewSettings: ReviewSettings = {
    timeZone: settings.timeZone,
    wrenchFloorPercent: settings.wrenchFloorPercent,
    verification: settings.verification,
    tooFastSecondsPerBolt: settings.tooFastSecondsPerBolt,
  };
  const order = ['LF', 'RF', 'LR', 'RR', 'spare'];
  const sorted = [...wheelRows].sort(
    (a, b) => order.indexOf(a.wheel.position) - order.indexOf(b.wheel.position),
  );
  const inputs = sorted.map(({ wheel, spec }) => {
    const basis = wheelBasis({
      snapshot: wheel.snapshot,
      spec,
      targetPressure: { value: wheel.targetPressure, unit: wheel.pressureUnit },
      steps,
    });
    const refused: RefusedEvent[] = refusedRows
      .filter((r) => r.wheelId === wheel.id)
      .map((r) => ({
        clientId: r.clientId,
        type: typeOf(r.raw),
        message: r.reason,
        at: r.at.toISOString(),
      }));
    const input: WheelReviewInput = {
      wheelId: wheel.id,
      position: wheel.position,
      plan: basis.plan,
      limits: { maxBeadSeat: basis.maxBeadSeat, targetPressure: basis.targetPressure },
      events: events.filter((e) => e.wheelId === wheel.id),
      photoKinds: photoRows.filter((p) => p.wheelId === wheel.id).map((p) => p.kind),
      requiredPhotos: sources.requiredPhotos,
      wrenches: wrenchList,
      verifications,
      refused,
      submittedAt: wheel.submittedAt?.toISOString() ?? null,
      flaggedReason: wheel.flaggedReason,
    };
    return { wheel, basis, input };
  });

  const personIds = [
    ...new Set([...events.map((e) => e.byId), ...(job.assigneeId ? [job.assigneeId] : [])]),
  ];
  const people = personIds.length
    ? Object.fromEntries(
        (
          await db
            .select({ id: users.id, name: users.name })
            .from(users)
            .where(and(eq(users.shopId, shopId), inArray(users.id, personIds)))
        ).map((u) => [u.id, u.name]),
      )
    : {};
  const reviewInput: JobReviewInput = {
    wheels: inputs.map((i) => i.input),
    settings: reviewSettings,
    assigneeId: job.assigneeId,
    people,
    vinCheckOverridden: job.vinCheckOverridden,
    axleWarnings: sources.axleWarnings(
      sorted.map(({ wheel }) => ({ position: wheel.position, tireSize: wheel.tireSize })),
    ),
  };

  return {
    job: {
      id: job.id,
      number: job.number,
      state: job.state,
      customerName: job.customerName,
      vehicleLabel:
        [job.year, job.make, job.model].filter(Boolean).join(' ') || job.description || 'Vehicle',
      vin: job.vin,
      assignee: job.assigneeId ? { id: job.assigneeId, name: people[job.assigneeId] ?? '' } : null,
      dismount: job.dismount,
      reinstall: job.reinstall,
    },
    timeZone: settings.timeZone,
    people,
    anomalies: jobAnomalies(reviewInput),
    wheels: inputs.map(({ wheel, basis, input }) => {
      const record = wheelRecord(basis.plan, input.events);
      return {
        ...basis,
        id: wheel.id,
        position: wheel.position,
        tireSize: wheel.tireSize,
        submittedAt: input.submittedAt,
        flaggedReason: wheel.flaggedReason,
        rework: wheel.rework
          ? { note: wheel.rework.note, steps: wheel.rework.steps, at: wheel.rework.at }
          : null,
        record,
        wrenchUses: Object.fromEntries(
          record.passes.map((p) => [p.index, wrenchUses(p, input, reviewSettings)]),
        ),
        photos: photoRows
          .filter((p) => p.wheelId === wheel.id)
          .map((p) => ({
            id: p.id,
            kind: p.kind,
            note: p.note,
            url: `/api/photos/${p.id}`,
            at: p.createdAt.toISOString(),
          })),
        refused: [...input.refused],
      };
    }),
  };
}

const typeOf = (raw: unknown) =>
  raw && typeof raw === 'object' && typeof (raw as { type?: unknown }).type === 'string'
    ? (raw as { type: string }).type
    : null;

/** Verifications and status changes of the wrenches used, over the window the policy can reach back from the first bolt. */
async function wrenchHistory(
  shopId: string,
  wrenchIds: string[],
  events: ReviewEvent[],
  days: number,
) {
  if (!wrenchIds.length || !events.length) return [[], []] as const;
  const times = events.map((e) => Date.parse(e.clientAt));
  const from = new Date(Math.min(...times) - (Math.max(1, days) + 2) * DAY_MS);
  const to = new Date(Math.max(...times) + DAY_MS);
  const db = getDb();
  const [verifications, statuses] = await Promise.all([
    db
      .select({
        wrenchId: wrenchVerifications.wrenchId,
        recordedAt: wrenchVerifications.recordedAt,
        referenceValue: wrenchVerifications.referenceValue,
        unit: wrenchVerifications.unit,
        withinTolerance: wrenchVerifications.withinTolerance,
      })
      .from(wrenchVerifications)
      .where(
        and(
          eq(wrenchVerifications.shopId, shopId),
          inArray(wrenchVerifications.wrenchId, wrenchIds),
          gte(wrenchVerifications.recordedAt, from),
          lte(wrenchVerifications.recordedAt, to),
        ),
      ),
    db
      .select({
        wrenchId: wrenchStatusEvents.wrenchId,
        status: wrenchStatusEvents.status,
        reason: wrenchStatusEvents.reason,
        at: wrenchStatusEvents.at,
      })
      .from(wrenchStatusEvents)
      .where(
        and(
          eq(wrenchStatusEvents.shopId, shopId),
          inArray(wrenchStatusEvents.wrenchId, wrenchIds),
          lte(wrenchStatusEvents.at, to),
        ),
      ),
  ]);
  const recorded: RecordedVerification[] = verifications.map((v) => ({
    ...v,
    recordedAt: v.recordedAt.toISOString(),
  }));
  return [recorded, statuses] as const;
}
