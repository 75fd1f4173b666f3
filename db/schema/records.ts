import { sql } from 'drizzle-orm';
import {
  boolean,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { users } from './auth';
import { createdAt, shopId } from './columns';

export const torqueUnitEnum = pgEnum('torque_unit', ['lbf-ft', 'lbf-in', 'Nm']);
export const pressureUnitEnum = pgEnum('pressure_unit', ['psi', 'kPa', 'bar']);
export const patternKindEnum = pgEnum('pattern_kind', ['cross', 'skip', 'sequential']);
export const wrenchKindEnum = pgEnum('wrench_kind', ['click', 'beam', 'dial', 'digital']);
export const wrenchStatusEnum = pgEnum('wrench_status', ['in_service', 'out_of_service']);
export const jobStateEnum = pgEnum('job_state', [
  'open',
  'in_progress',
  'awaiting_signoff',
  'signed_off',
  'sent_back',
]);
/** How the wheel maker wants the ring bolts' threads when torqued: the torque means nothing without it. */
export const threadConditionEnum = pgEnum('thread_condition', [
  'dry',
  'oiled',
  'anti_seize',
  'thread_locker',
]);
export const wheelPositionEnum = pgEnum('wheel_position', ['LF', 'RF', 'LR', 'RR', 'spare']);

/** A wheel spec: how one kind of beadlock wheel is torqued and inflated. */
export const wheelSpecs = pgTable(
  'wheel_specs',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: shopId(),
    name: text().notNull(),
    boltCount: integer().notNull(),
    boltThread: text().notNull(),
    finalTorque: doublePrecision().notNull(),
    torqueUnit: torqueUnitEnum().notNull(),
    passFractions: jsonb().$type<number[]>().notNull(),
    patternKind: patternKindEnum().notNull(),
    skipStep: integer(),
    checkPass: boolean().notNull().default(true),
    lugTorque: doublePrecision(),
    lugTorqueUnit: torqueUnitEnum(),
    lugCount: integer(),
    maxBeadSeatPressure: doublePrecision().notNull(),
    runningPressure: doublePrecision().notNull(),
    pressureUnit: pressureUnitEnum().notNull(),
    makerReference: text().notNull().default(''),
    notes: text().notNull().default(''),
    /**
     * The tire maker's published rating that allows a bead-seating limit above the industry's
     * 40 psi guidance (document, page); required, with a lead's confirmation, for such a limit.
     */
    beadSeatRatingReference: text().notNull().default(''),
    beadSeatRatingConfirmedById: uuid().references(() => users.id),
    beadSeatRatingConfirmedAt: timestamp({ withTimezone: true }),
    /**
     * Why a stored spec fails the plausibility rules (set by migration 0003 for rows stored before
     * the rules existed); null when it passes. The runner will not start a wheel on a flagged spec.
     */
    plausibilityFlag: text(),
    /** As the wheel maker specifies; null: the spec does not say (the runner tells the technician to check). */
    threadCondition: threadConditionEnum(),
    /** The maker's rule for reusing ring bolts ("replace every ring removal", "reuse if undamaged"…). */
    boltReuse: text().notNull().default(''),
    createdAt: createdAt(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('wheel_specs_shop_idx').on(t.shopId, t.name)],
);

/** A torque wrench in the tool crib. */
export const wrenches = pgTable(
  'wrenches',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: shopId(),
    label: text().notNull(),
    kind: wrenchKindEnum().notNull(),
    min: doublePrecision().notNull(),
    max: doublePrecision().notNull(),
    unit: torqueUnitEnum().notNull(),
    graduation: doublePrecision().notNull(),
    serial: text().notNull().default(''),
    calibrationDueOn: date({ mode: 'string' }).notNull(),
    cyclesSinceCalibration: integer(),
    status: wrenchStatusEnum().notNull().default('in_service'),
    statusReason: text().notNull().default(''),
    createdAt: createdAt(),
  },
  (t) => [index('wrenches_shop_idx').on(t.shopId, t.label)],
);

/** A reading against a reference, judged by the engine at the time it was recorded. */
export const wrenchVerifications = pgTable(
  'wrench_verifications',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: shopId(),
    wrenchId: uuid()
      .notNull()
      .references(() => wrenches.id, { onDelete: 'cascade' }),
    referenceValue: doublePrecision().notNull(),
    readingValue: doublePrecision().notNull(),
    unit: torqueUnitEnum().notNull(),
    deviationPct: doublePrecision().notNull(),
    tolerancePct: doublePrecision().notNull(),
    withinTolerance: boolean().notNull(),
    recordedById: uuid()
      .notNull()
      .references(() => users.id),
    recordedAt: createdAt(),
  },
  (t) => [index('wrench_verifications_wrench_idx').on(t.wrenchId, t.recordedAt)],
);

/** Every change of a wrench's service status: automatic (verification, calibration) or by a lead. */
export const wrenchStatusEvents = pgTable(
  'wrench_status_events',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: shopId(),
    wrenchId: uuid()
      .notNull()
      .references(() => wrenches.id, { onDelete: 'cascade' }),
    status: wrenchStatusEnum().notNull(),
    reason: text().notNull(),
    byId: uuid().references(() => users.id),
    at: createdAt(),
  },
  (t) => [index('wrench_status_events_wrench_idx').on(t.wrenchId, t.at)],
);

export const customers = pgTable(
  'customers',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: shopId(),
    name: text().notNull(),
    phone: text().notNull().default(''),
    email: text().notNull().default(''),
    createdAt: createdAt(),
  },
  (t) => [index('customers_shop_idx').on(t.shopId, t.name)],
);

export const vehicles = pgTable(
  'vehicles',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: shopId(),
    customerId: uuid()
      .notNull()
      .references(() => customers.id, { onDelete: 'cascade' }),
    year: integer(),
    make: text().notNull().default(''),
    model: text().notNull().default(''),
    description: text().notNull().default(''),
    vin: text(),
    /** A lead accepted a VIN whose check digit does not compute (off-road vehicles vary). */
    vinCheckOverridden: boolean().notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [index('vehicles_customer_idx').on(t.shopId, t.customerId)],
);

export const jobs = pgTable(
  'jobs',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: shopId(),
    /** Shop-local number people say out loud ("job 1042"). */
    number: integer().notNull(),
    customerId: uuid()
      .notNull()
      .references(() => customers.id),
    vehicleId: uuid()
      .notNull()
      .references(() => vehicles.id),
    state: jobStateEnum().notNull().default('open'),
    assigneeId: uuid().references(() => users.id),
    dueAt: timestamp({ withTimezone: true }),
    dismount: boolean().notNull().default(true),
    reinstall: boolean().notNull().default(true),
    notes: text().notNull().default(''),
    createdById: uuid()
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('jobs_shop_number_key').on(t.shopId, t.number),
    index('jobs_board_idx').on(t.shopId, t.state, t.dueAt),
    index('jobs_assignee_idx').on(t.shopId, t.assigneeId, t.dueAt),
  ],
);

export const jobWheels = pgTable(
  'job_wheels',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: shopId(),
    jobId: uuid()
      .notNull()
      .references(() => jobs.id, { onDelete: 'cascade' }),
    position: wheelPositionEnum().notNull(),
    specId: uuid()
      .notNull()
      .references(() => wheelSpecs.id),
    tireSize: text().notNull(),
    directional: boolean().notNull().default(false),
    targetPressure: doublePrecision().notNull(),
    pressureUnit: pressureUnitEnum().notNull(),
    /** Set when the technician submits the wheel from the runner; cleared when a lead sends the wheel back. */
    submittedAt: timestamp({ withTimezone: true }),
    /** Who submitted it: a lead who submitted a wheel of a job may not sign that job off. */
    submittedById: uuid().references(() => users.id),
    /** A failed inspection stops the wheel and flags it for the lead (parts needed). */
    flaggedReason: text(),
    /** When the wheel's run started (its first stored event); the snapshot was taken then. */
    startedAt: timestamp({ withTimezone: true }),
    /**
     * The spec and plan as they were when the run started. The runner, its save path, the review
     * and reports read this once it exists, so editing the spec later never changes a past record.
     * Null until the first event is stored.
     */
    snapshot: jsonb().$type<WheelSnapshot>(),
    /**
     * The lead's send-back for this wheel (null when it was never sent back): the note the
     * technician sees at the top of the runner and the steps to redo (empty = the whole wheel).
     */
    rework: jsonb().$type<WheelRework>(),
  },
  (t) => [
    uniqueIndex('job_wheels_position_key').on(t.jobId, t.position),
    index('job_wheels_shop_idx').on(t.shopId),
  ],
);

type TorqueValue = { value: number; unit: (typeof torqueUnitEnum.enumValues)[number] };
type PressureValue = { value: number; unit: (typeof pressureUnitEnum.enumValues)[number] };

/**
 * `job_wheels.snapshot`: what the technician was told to do, frozen at the run's first event.
 * Units travel with every number. `passes[i].index` is the pass number events carry (1-based);
 * `order` is the bolt sequence that pass follows (the check pass goes round in order).
 */
export type WheelSnapshot = {
  version: 1;
  takenAt: string;
  spec: {
    id: string;
    name: string;
    boltCount: number;
    boltThread: string;
    pattern: { kind: (typeof patternKindEnum.enumValues)[number]; step: number | null };
    passFractions: number[];
    checkPass: boolean;
    finalTorque: TorqueValue;
    maxBeadSeatPressure: PressureValue;
    runningPressure: PressureValue;
    lugTorque: TorqueValue | null;
    lugCount: number | null;
    makerReference: string;
    /** Added after the first snapshots: absent on wheels started before. */
    notes?: string;
    threadCondition?: (typeof threadConditionEnum.enumValues)[number] | null;
    boltReuse?: string;
  };
  plan: {
    sequence: number[];
    passes: {
      index: number;
      kind: 'staged' | 'check';
      fraction: number;
      target: TorqueValue;
      order: number[];
    }[];
  };
  /** The wheel's own running-pressure target (from the job card) at the start. */
  targetPressure: PressureValue;
};

/** `job_wheels.rework`: a lead's send-back of one wheel. `steps` empty = redo the whole wheel. */
export type WheelRework = { note: string; steps: string[]; byId: string; at: string };

export type WheelSpecRow = typeof wheelSpecs.$inferSelect;
export type WrenchRow = typeof wrenches.$inferSelect;
export type JobState = (typeof jobStateEnum.enumValues)[number];
export type WheelPosition = (typeof wheelPositionEnum.enumValues)[number];

/** Every state change of a job card: who moved it, from what, to what, and why. */
export const jobEvents = pgTable(
  'job_events',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: shopId(),
    jobId: uuid()
      .notNull()
      .references(() => jobs.id, { onDelete: 'cascade' }),
    action: text().notNull(),
    fromState: jobStateEnum(),
    toState: jobStateEnum().notNull(),
    byId: uuid()
      .notNull()
      .references(() => users.id),
    note: text().notNull().default(''),
    /**
     * A sign-off by a lead who worked on the job, allowed only by the shop's single-lead setting;
     * `note` then holds the lead's written reason, shown on the record.
     */
    selfSignoff: boolean().notNull().default(false),
    /** A send-back's wheels, each with its own note and optional steps to redo. */
    wheels: jsonb().$type<{ wheelId: string; note: string; steps: string[] }[]>(),
    at: createdAt(),
  },
  (t) => [index('job_events_job_idx').on(t.jobId, t.at)],
);

/**
 * What the technician confirmed in the runner, one row per event, each with the id the device
 * gave it: a replayed event is stored once. The wheel's progress is derived from these.
 * The device's id is the key (no surrogate id: nothing refers to a row but by it). Phones make it
 * time-ordered (features/runner/event-id.ts), so with millions of rows an insert still touches
 * only the newest pages of the key's index.
 */
export const wheelRunEvents = pgTable(
  'wheel_run_events',
  {
    shopId: shopId(),
    jobId: uuid()
      .notNull()
      .references(() => jobs.id, { onDelete: 'cascade' }),
    wheelId: uuid()
      .notNull()
      .references(() => jobWheels.id, { onDelete: 'cascade' }),
    clientId: uuid().primaryKey(),
    type: text().notNull(),
    payload: jsonb().$type<Record<string, unknown>>().notNull(),
    byId: uuid()
      .notNull()
      .references(() => users.id),
    /** When it happened by the phone, clamped to the server's clock (24 h back, 5 min ahead). */
    clientAt: timestamp({ withTimezone: true }).notNull(),
    /** The phone's own time when it differed from `clientAt` (clamped), else null. */
    deviceAt: timestamp({ withTimezone: true }),
    /** The phone that sent it (its own random id, made once per browser); null for events from before phones had one. */
    deviceId: uuid(),
    receivedAt: createdAt(),
    /**
     * Set on every event of a wheel when a lead sends that wheel back: the event stays in the
     * history, but the runner's reducer and the anomalies read only events where this is null.
     */
    supersededAt: timestamp({ withTimezone: true }),
  },
  (t) => [
    index('wheel_run_events_wheel_idx').on(t.wheelId, t.clientAt),
    // The quick save's wrench check (features/runner/server/one-statement-save.ts): was this
    // wrench chosen for this pass? Only current choices, so it reads a wheel's few choices, not
    // its whole history. The expressions must stay as the query writes them for the planner to
    // match; the wrench id is left out (one or two choices per pass; it would double the size).
    index('wheel_run_events_wrench_chosen_idx')
      .on(t.wheelId, sql`((${t.payload}->>'pass')::int)`)
      .where(sql`${t.type} = 'wrench_chosen' and ${t.supersededAt} is null`),
  ],
);

export const photoKindEnum = pgEnum('photo_kind', ['bead_outer', 'bead_inner', 'other']);

/** Evidence for a wheel: the file lives with the upload service; this row says what it shows. */
export const wheelPhotos = pgTable(
  'wheel_photos',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: shopId(),
    jobId: uuid()
      .notNull()
      .references(() => jobs.id, { onDelete: 'cascade' }),
    wheelId: uuid()
      .notNull()
      .references(() => jobWheels.id, { onDelete: 'cascade' }),
    kind: photoKindEnum().notNull(),
    note: text().notNull().default(''),
    fileKey: text().notNull(),
    url: text().notNull(),
    bytes: integer().notNull(),
    mime: text().notNull(),
    uploadedById: uuid()
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('wheel_photos_file_key').on(t.fileKey),
    index('wheel_photos_wheel_idx').on(t.wheelId),
  ],
);

/**
 * Runner events the server refused for good (off the plan, a wrench that may not be used, a closed
 * wheel, bad data). The phone keeps them in its "Needs attention" list; the review shows these
 * rows so nothing a technician tapped disappears silently. `raw` is the event as the phone sent it.
 */
export const refusedRunEvents = pgTable(
  'refused_run_events',
  {
    id: uuid().primaryKey().defaultRandom(),
    shopId: shopId(),
    jobId: uuid()
      .notNull()
      .references(() => jobs.id, { onDelete: 'cascade' }),
    wheelId: uuid()
      .notNull()
      .references(() => jobWheels.id, { onDelete: 'cascade' }),
    /** The device's id for the event when it had a readable one. */
    clientId: text(),
    byId: uuid()
      .notNull()
      .references(() => users.id),
    reason: text().notNull(),
    raw: jsonb().$type<unknown>().notNull(),
    at: createdAt(),
  },
  (t) => [
    uniqueIndex('refused_run_events_client_key').on(t.wheelId, t.clientId),
    index('refused_run_events_job_idx').on(t.shopId, t.jobId, t.at),
  ],
);
