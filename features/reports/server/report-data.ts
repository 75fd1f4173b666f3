import 'server-only';
import { and, desc, eq, inArray, isNull, lte } from 'drizzle-orm';
import { getDb } from '@/db';
import {
  anomalyAcknowledgements,
  customers,
  jobEvents,
  jobs,
  jobWheels,
  recheckReminders,
  shops,
  users,
  vehicles,
  wheelPhotos,
  wheelRunEvents,
  wrenches,
  wrenchVerifications,
} from '@/db/schema';
import { notFound } from '@/server/errors';
import { getShopSettings } from '@/server/shop/settings';
import type { ReportData, ReportWrench } from '../types';

const POSITION_ORDER = ['LF', 'RF', 'LR', 'RR', 'spare'];
const iso = (d: Date) => d.toISOString();

/** The job card as the report tells it, read-only from this shop's rows; another shop's job is not found. */
export async function getReportData(shopId: string, jobId: string): Promise<ReportData> {
  const db = getDb();
  const [job] = await db
    .select({
      id: jobs.id,
      number: jobs.number,
      state: jobs.state,
      createdAt: jobs.createdAt,
      dismount: jobs.dismount,
      reinstall: jobs.reinstall,
      shopName: shops.name,
      customerName: customers.name,
      customerEmail: customers.email,
      customerPhone: customers.phone,
      year: vehicles.year,
      make: vehicles.make,
      model: vehicles.model,
      description: vehicles.description,
      vin: vehicles.vin,
    })
    .from(jobs)
    .innerJoin(shops, eq(shops.id, jobs.shopId))
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(vehicles, eq(vehicles.id, jobs.vehicleId))
    .where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)));
  if (!job) throw notFound('That job card');

  const [settings, wheelRows, eventRows, photoRows, signOffRows, recheckRows, ackRows] =
    await Promise.all([
      getShopSettings(shopId),
      db
        .select({
          id: jobWheels.id,
          position: jobWheels.position,
          tireSize: jobWheels.tireSize,
          directional: jobWheels.directional,
          targetPressure: jobWheels.targetPressure,
          pressureUnit: jobWheels.pressureUnit,
          snapshot: jobWheels.snapshot,
          submittedAt: jobWheels.submittedAt,
          submittedById: jobWheels.submittedById,
        })
        .from(jobWheels)
        .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.jobId, jobId))),
      db
        .select({
          wheelId: wheelRunEvents.wheelId,
          clientId: wheelRunEvents.clientId,
          type: wheelRunEvents.type,
          payload: wheelRunEvents.payload,
          byId: wheelRunEvents.byId,
          clientAt: wheelRunEvents.clientAt,
        })
        .from(wheelRunEvents)
        .where(
          and(
            eq(wheelRunEvents.shopId, shopId),
            eq(wheelRunEvents.jobId, jobId),
            isNull(wheelRunEvents.supersededAt),
          ),
        )
        .orderBy(wheelRunEvents.clientAt, wheelRunEvents.clientId),
      db
        .select({
          id: wheelPhotos.id,
          wheelId: wheelPhotos.wheelId,
          kind: wheelPhotos.kind,
          note: wheelPhotos.note,
          createdAt: wheelPhotos.createdAt,
        })
        .from(wheelPhotos)
        .where(and(eq(wheelPhotos.shopId, shopId), eq(wheelPhotos.jobId, jobId)))
        .orderBy(wheelPhotos.createdAt),
      db
        .select({ byId: jobEvents.byId, at: jobEvents.at, selfSignoff: jobEvents.selfSignoff })
        .from(jobEvents)
        .where(
          and(
            eq(jobEvents.shopId, shopId),
            eq(jobEvents.jobId, jobId),
            eq(jobEvents.action, 'sign_off'),
          ),
        )
        .orderBy(desc(jobEvents.at))
        .limit(1),
      db
        .select({ dueOn: recheckReminders.dueOn, status: recheckReminders.status })
        .from(recheckReminders)
        .where(and(eq(recheckReminders.shopId, shopId), eq(recheckReminders.jobId, jobId))),
      db
        .select({
          wheelId: anomalyAcknowledgements.wheelId,
          message: anomalyAcknowledgements.message,
          reason: anomalyAcknowledgements.reason,
          byId: anomalyAcknowledgements.byId,
          at: anomalyAcknowledgements.at,
        })
        .from(anomalyAcknowledgements)
        .where(
          and(eq(anomalyAcknowledgements.shopId, shopId), eq(anomalyAcknowledgements.jobId, jobId)),
        )
        .orderBy(anomalyAcknowledgements.at),
    ]);

  const signOff = signOffRows[0] ?? null;
  const personIds = new Set<string>([
    ...eventRows.map((e) => e.byId),
    ...ackRows.map((a) => a.byId),
    ...wheelRows.flatMap((w) => (w.submittedById ? [w.submittedById] : [])),
    ...(signOff ? [signOff.byId] : []),
  ]);
  const wrenchIds = new Set(
    eventRows.map((e) => e.payload.wrenchId).filter((id): id is string => typeof id === 'string'),
  );
  const [people, crib] = await Promise.all([
    personIds.size
      ? db
          .select({ id: users.id, name: users.name, email: users.email })
          .from(users)
          .where(and(eq(users.shopId, shopId), inArray(users.id, [...personIds])))
      : [],
    readWrenches(shopId, [...wrenchIds], signOff?.at ?? new Date()),
  ]);
  const signer = signOff ? people.find((p) => p.id === signOff.byId) : undefined;

  return {
    shop: { name: job.shopName, contact: signer?.email ?? null },
    timeZone: settings.timeZone,
    recheckDays: settings.recheckDays,
    job: {
      id: job.id,
      number: job.number,
      state: job.state,
      createdAt: iso(job.createdAt),
      dismount: job.dismount,
      reinstall: job.reinstall,
      customer: { name: job.customerName, email: job.customerEmail, phone: job.customerPhone },
      vehicle: {
        year: job.year,
        make: job.make,
        model: job.model,
        description: job.description,
        vin: job.vin,
      },
    },
    signOff: signOff
      ? { byId: signOff.byId, at: iso(signOff.at), selfSignoff: signOff.selfSignoff }
      : null,
    recheck: recheckRows[0] ?? null,
    wheels: [...wheelRows]
      .sort((a, b) => POSITION_ORDER.indexOf(a.position) - POSITION_ORDER.indexOf(b.position))
      .map((w) => ({
        id: w.id,
        position: w.position,
        tireSize: w.tireSize,
        directional: w.directional,
        targetPressure: { value: w.targetPressure, unit: w.pressureUnit },
        snapshot: w.snapshot,
        submittedAt: w.submittedAt ? iso(w.submittedAt) : null,
        submittedById: w.submittedById,
        events: eventRows
          .filter((e) => e.wheelId === w.id)
          .map((e) => ({
            clientId: e.clientId,
            type: e.type,
            payload: e.payload,
            byId: e.byId,
            clientAt: iso(e.clientAt),
          })),
        photos: photoRows
          .filter((p) => p.wheelId === w.id)
          .map((p) => ({
            id: p.id,
            wheelId: p.wheelId,
            kind: p.kind,
            note: p.note,
            at: iso(p.createdAt),
          })),
      })),
    acknowledgements: ackRows.map((a) => ({ ...a, at: iso(a.at) })),
    people: Object.fromEntries(people.map((p) => [p.id, p.name])),
    wrenches: crib,
  };
}

/** The wrenches the events name, each with its last verification recorded before `until`. */
async function readWrenches(
  shopId: string,
  ids: string[],
  until: Date,
): Promise<Record<string, ReportWrench>> {
  if (!ids.length) return {};
  const db = getDb();
  const [rows, checks] = await Promise.all([
    db
      .select({
        id: wrenches.id,
        label: wrenches.label,
        kind: wrenches.kind,
        serial: wrenches.serial,
        unit: wrenches.unit,
        graduation: wrenches.graduation,
      })
      .from(wrenches)
      .where(and(eq(wrenches.shopId, shopId), inArray(wrenches.id, ids))),
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
          inArray(wrenchVerifications.wrenchId, ids),
          lte(wrenchVerifications.recordedAt, until),
        ),
      )
      .orderBy(desc(wrenchVerifications.recordedAt)),
  ]);
  return Object.fromEntries(
    rows.map((w) => {
      const last = checks.find((c) => c.wrenchId === w.id);
      const { id, ...rest } = w;
      return [
        id,
        {
          ...rest,
          lastVerification: last
            ? {
                at: iso(last.recordedAt),
                reference: { value: last.referenceValue, unit: last.unit },
                withinTolerance: last.withinTolerance,
              }
            : null,
        },
      ];
    }),
  );
}
