/**
 * The demo shop's wheel records, consistent with the rules a real run follows: every job card
 * past "open" was started by its assignee; jobs awaiting sign-off, signed off or sent back carry
 * complete wheel histories (every step, every bolt of every pass with the wrench and setting the
 * runner would have shown, a same-day verification of each wrench near its setting, both bead
 * photos, submitted wheels) by the technician, so the demo lead did none of the work and may sign
 * them off; jobs in progress carry partial histories. One job awaiting sign-off has a pass
 * confirmed far too fast, an anomaly worth a look. Times are on past days (UTC, the demo shop's
 * zone), so nothing lies in the future or crosses midnight.
 */
import { randomUUID } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { eq } from 'drizzle-orm';
import type { PostgresJsDatabase } from 'drizzle-orm/postgres-js';
import * as schema from './schema';
import type { DemoWheelPlan } from './seed-check';

type Db = PostgresJsDatabase<typeof schema>;
type State = (typeof schema.jobStateEnum.enumValues)[number];
type Spec = Omit<typeof schema.wheelSpecs.$inferInsert, 'shopId'> & {
  id: string;
  plan: DemoWheelPlan;
};
type Event = { type: string; payload: Record<string, unknown>; at: number; by: string };

export type DemoJob = {
  id: string;
  state: State;
  assignee: string | null;
  spec: Spec;
  workDay: number;
  wheels: {
    id: string;
    position: string;
    targetPressure: number;
    pressureUnit: 'psi' | 'kPa' | 'bar';
  }[];
};
export type DemoWorkInput = {
  shopId: string;
  lead: string;
  wrenchIds: string[];
  jobs: DemoJob[];
  photoDir?: string;
};

const PHOTO_SOURCE = path.join(path.dirname(fileURLToPath(import.meta.url)), 'demo-photos');
const eqId = (id: string) => eq(schema.jobWheels.id, id);
const SECOND = 1000;
const MINUTE = 60 * SECOND;
const dayStart = (offsetDays: number) => {
  const now = new Date();
  return Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() + offsetDays);
};

// The runner's checklist item ids per step (features/runner/steps.ts), ticked as a technician would.
export const CHECKLISTS: Record<string, string[]> = {
  safety: ['off-vehicle', 'deflated', 'core-out'],
  dismount: ['bolts-out', 'inner-bead', 'tire-off'],
  clean: ['faces-deburred', 'ring-clean', 'holes-blown'],
  inspect: ['no-cracks', 'no-bends', 'threads-ok', 'bolts-ok'],
  mount: ['lubed', 'fitted', 'outer-centred', 'direction'],
  index: ['notch'],
  seat_bead: ['strap', 'restrained', 'clip-chuck', 'seated', 'strap-off', 'ring-gap'],
  leak_check: ['core-in', 'inflated', 'soapy'],
  reinstall: ['star', 'lug-torque'],
};

export function demoSnapshot(
  spec: Spec,
  wheel: DemoJob['wheels'][number],
  takenAt: number,
): schema.WheelSnapshot {
  return {
    version: 1,
    takenAt: new Date(takenAt).toISOString(),
    spec: {
      id: spec.id,
      name: spec.name,
      boltCount: spec.boltCount,
      boltThread: spec.boltThread,
      pattern: {
        kind: spec.patternKind,
        step: spec.patternKind === 'skip' ? (spec.skipStep ?? 1) : null,
      },
      passFractions: [...spec.passFractions],
      checkPass: spec.checkPass ?? true,
      finalTorque: { value: spec.finalTorque, unit: spec.torqueUnit },
      maxBeadSeatPressure: { value: spec.maxBeadSeatPressure, unit: spec.pressureUnit },
      runningPressure: { value: spec.runningPressure, unit: spec.pressureUnit },
      lugTorque:
        spec.lugTorque && spec.lugTorqueUnit
          ? { value: spec.lugTorque, unit: spec.lugTorqueUnit }
          : null,
      lugCount: spec.lugCount ?? null,
      makerReference: spec.makerReference ?? '',
    },
    plan: {
      sequence: spec.plan.sequence,
      passes: spec.plan.passes.map((p) => ({
        index: p.index,
        kind: p.kind,
        fraction: p.fraction,
        target: p.target,
        order: p.kind === 'check' ? spec.plan.check : spec.plan.sequence,
      })),
    },
    targetPressure: { value: wheel.targetPressure, unit: wheel.pressureUnit },
  };
}

/**
 * One wheel's events from `start`, as the runner records them. `until`: stop after hand-starting
 * and half of pass 1 (a wheel in progress). `tooFastPass`: that pass confirmed at 0.6 s a bolt.
 */
function wheelEvents(
  job: DemoJob,
  wheel: DemoJob['wheels'][number],
  by: string,
  wrenchIds: string[],
  start: number,
  options: { partial?: boolean; tooFastPass?: number } = {},
) {
  const { spec } = job;
  const events: Event[] = [];
  let t = start;
  const add = (type: string, payload: Record<string, unknown>, gap: number) => {
    t += gap;
    events.push({ type, payload, at: t, by });
  };
  const done = (step: string, extra: Record<string, unknown> = {}) =>
    add('step_done', { step, checklist: CHECKLISTS[step] ?? [], ...extra }, 90 * SECOND);
  for (const step of ['safety', 'dismount', 'clean', 'inspect', 'mount', 'index']) done(step);
  for (const bolt of spec.plan.sequence) add('hand_started', { bolt }, 4 * SECOND);
  done('hand_start');
  for (const pass of spec.plan.passes) {
    const wrenchId = wrenchIds[pass.wrench]!;
    add('wrench_chosen', { pass: pass.index, wrenchId }, 40 * SECOND);
    const order = pass.kind === 'check' ? spec.plan.check : spec.plan.sequence;
    const bolts =
      options.partial && pass.index === 1 ? order.slice(0, Math.ceil(order.length / 2)) : order;
    for (const bolt of bolts) {
      add(
        'bolt_confirmed',
        { pass: pass.index, bolt, wrenchId, setting: pass.setting, target: pass.target },
        options.tooFastPass === pass.index ? 600 : 5 * SECOND,
      );
    }
    if (options.partial) return { events, end: t, photosAt: null };
  }
  done('torque');
  const photosAt = t + 2 * MINUTE;
  const seat = Math.round(spec.maxBeadSeatPressure * 0.8 * 10) / 10;
  t += 3 * MINUTE;
  done('seat_bead', { measurement: { value: seat, unit: spec.pressureUnit } });
  done('leak_check', { measurement: { value: wheel.targetPressure, unit: wheel.pressureUnit } });
  done('reinstall');
  return { events, end: t, photosAt };
}

const PHOTOS = { bead_outer: 'bead-outer.png', bead_inner: 'bead-inner.png' } as const;

/** Writes a demo bead photo where the local upload fake keeps private files, and answers its key. */
function storePhoto(
  dir: string | undefined,
  kind: keyof typeof PHOTOS,
): { key: string; bytes: number } {
  const key = `demo-${kind}-${randomUUID()}`;
  const bytes = readFileSync(path.join(PHOTO_SOURCE, PHOTOS[kind]));
  if (dir) {
    mkdirSync(dir, { recursive: true });
    writeFileSync(path.join(dir, key), bytes);
    writeFileSync(
      path.join(dir, `${key}.json`),
      JSON.stringify({ type: 'image/png', name: PHOTOS[kind], acl: 'private' }),
    );
  }
  return { key, bytes: bytes.byteLength };
}

export async function seedDemoWork(tx: Db, input: DemoWorkInput) {
  const { shopId, lead, wrenchIds } = input;
  const runEvents: (typeof schema.wheelRunEvents.$inferInsert)[] = [];
  const jobEvents: (typeof schema.jobEvents.$inferInsert)[] = [];
  const photos: (typeof schema.wheelPhotos.$inferInsert)[] = [];
  const verifications = new Map<string, typeof schema.wrenchVerifications.$inferInsert>();
  let anomalyPlaced = false;

  for (const job of input.jobs) {
    const createdAt = new Date(dayStart(job.workDay) + 7 * 60 * MINUTE);
    jobEvents.push({
      shopId,
      jobId: job.id,
      action: 'create',
      fromState: null,
      toState: 'open',
      byId: lead,
      note: 'Demo record',
      at: createdAt,
    });
    if (job.state === 'open') continue;
    const by = job.assignee ?? lead;
    const startedAt = dayStart(job.workDay) + 8 * 60 * MINUTE;
    jobEvents.push({
      shopId,
      jobId: job.id,
      action: 'start',
      fromState: 'open',
      toState: 'in_progress',
      byId: by,
      note: '',
      at: new Date(startedAt),
    });
    // The wrenches were checked on the tester that morning, at the settings the passes use.
    for (const pass of job.spec.plan.passes) {
      const key = `${job.workDay}:${pass.wrench}:${pass.setting.value}`;
      const v = pass.setting.value;
      verifications.set(key, {
        shopId,
        wrenchId: wrenchIds[pass.wrench]!,
        referenceValue: v,
        readingValue: Math.round(v * 1.005 * 100) / 100,
        unit: pass.setting.unit,
        deviationPct: 0.5,
        tolerancePct: 4,
        withinTolerance: true,
        recordedById: by,
        recordedAt: new Date(startedAt - 15 * MINUTE),
      });
    }
    const partial = job.state === 'in_progress';
    const tooFast = job.state === 'awaiting_signoff' && !anomalyPlaced;
    let t = startedAt;
    let submittedAt = startedAt;
    const wheelUpdates: {
      id: string;
      snapshot: schema.WheelSnapshot;
      startedAt: Date;
      submittedAt: Date | null;
    }[] = [];
    for (const [w, wheel] of job.wheels.entries()) {
      if (partial && w > 0) break; // a job in progress: the first wheel part-way, the others not started
      const run = wheelEvents(job, wheel, by, wrenchIds, t, {
        partial,
        tooFastPass: tooFast && w === 1 ? 2 : undefined,
      });
      for (const e of run.events)
        runEvents.push({
          shopId,
          jobId: job.id,
          wheelId: wheel.id,
          clientId: randomUUID(),
          type: e.type,
          payload: e.payload,
          byId: e.by,
          clientAt: new Date(e.at),
          receivedAt: new Date(e.at + 2 * SECOND),
        });
      if (run.photosAt) {
        for (const kind of ['bead_outer', 'bead_inner'] as const) {
          const file = storePhoto(input.photoDir, kind);
          photos.push({
            shopId,
            jobId: job.id,
            wheelId: wheel.id,
            kind,
            fileKey: file.key,
            url: `demo:${file.key}`,
            bytes: file.bytes,
            mime: 'image/png',
            uploadedById: by,
            createdAt: new Date(run.photosAt),
          });
        }
      }
      submittedAt = run.end + MINUTE;
      wheelUpdates.push({
        id: wheel.id,
        snapshot: demoSnapshot(job.spec, wheel, t + SECOND),
        startedAt: new Date(t + SECOND),
        submittedAt: partial ? null : new Date(submittedAt),
      });
      t = run.end + 5 * MINUTE;
    }
    if (tooFast) anomalyPlaced = true;
    for (const u of wheelUpdates) {
      await tx
        .update(schema.jobWheels)
        .set({
          snapshot: u.snapshot,
          startedAt: u.startedAt,
          submittedAt: u.submittedAt,
          submittedById: u.submittedAt ? by : null,
        })
        .where(eqId(u.id));
    }
    if (partial) continue;
    const submitted = new Date(submittedAt + MINUTE);
    jobEvents.push({
      shopId,
      jobId: job.id,
      action: 'submit',
      fromState: 'in_progress',
      toState: 'awaiting_signoff',
      byId: by,
      note: 'All wheels submitted from the runner.',
      at: submitted,
    });
    const reviewedAt = new Date(submitted.getTime() + 40 * MINUTE);
    if (job.state === 'signed_off') {
      jobEvents.push({
        shopId,
        jobId: job.id,
        action: 'sign_off',
        fromState: 'awaiting_signoff',
        toState: 'signed_off',
        byId: lead,
        note: 'Record reviewed; every pass in sequence.',
        at: reviewedAt,
      });
    }
    if (job.state === 'sent_back') {
      const lf = job.wheels[0]!;
      const rework = {
        wheelId: lf.id,
        note: 'The outer bead photo is blurred: seat check again and retake both bead photos.',
        steps: ['seat_bead'],
      };
      jobEvents.push({
        shopId,
        jobId: job.id,
        action: 'send_back',
        fromState: 'awaiting_signoff',
        toState: 'sent_back',
        byId: lead,
        note: 'Bead photo on the outer face was blurred; retake.',
        wheels: [rework],
        at: reviewedAt,
      });
      await tx
        .update(schema.jobWheels)
        .set({
          submittedAt: null,
          submittedById: null,
          rework: {
            note: rework.note,
            steps: rework.steps,
            byId: lead,
            at: reviewedAt.toISOString(),
          },
        })
        .where(eqId(lf.id));
      // The send-back supersedes the seat-bead step's events of that wheel (kept in the history).
      for (const e of runEvents) {
        if (
          e.wheelId === lf.id &&
          e.type === 'step_done' &&
          (e.payload as { step?: string }).step === 'seat_bead'
        )
          e.supersededAt = reviewedAt;
      }
    }
  }
  await tx.insert(schema.jobEvents).values(jobEvents);
  if (verifications.size)
    await tx.insert(schema.wrenchVerifications).values([...verifications.values()]);
  for (let i = 0; i < runEvents.length; i += 1000)
    await tx.insert(schema.wheelRunEvents).values(runEvents.slice(i, i + 1000));
  if (photos.length) await tx.insert(schema.wheelPhotos).values(photos);
}
