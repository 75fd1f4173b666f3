import type {
  Pressure,
  RecordedVerification,
  Torque,
  VerificationPolicy,
  Wrench,
} from '@/features/torque-plan';

/** One pass of the wheel's plan, as the technician was given it. */
export type ReviewPass = {
  index: number;
  kind: 'staged' | 'check';
  fraction: number;
  target: Torque;
  order: number[];
};

/** The steps the wheel's runner showed (id, title, whether it could be skipped). */
export type ReviewStep = { id: string; title: string; required: boolean };

/** The plan a wheel was run against: from its snapshot when there is one, else the live spec. */
export type ReviewPlan = { boltCount: number; passes: ReviewPass[]; steps: ReviewStep[] };

/** A stored runner event: what, when (device and server), by whom, and whether a rework replaced it. */
export type ReviewEvent = {
  clientId: string;
  type: string;
  payload: Record<string, unknown>;
  /** ISO instant on the device (clamped by the server). */
  clientAt: string;
  /** ISO instant the server stored it. */
  receivedAt: string;
  byId: string;
  /** The phone that sent it (its own id); absent or null for events from before phones kept one. */
  deviceId?: string | null;
  superseded: boolean;
};

/** A wrench as it stood: its range, its status changes over time and its calibration due day. */
export type ReviewWrench = Wrench & {
  label: string;
  /** 'YYYY-MM-DD', the day the calibration falls due. */
  calibrationDueOn: string;
  /** Every status change, any order; before the first one the wrench was in service. */
  statusHistory: { status: 'in_service' | 'out_of_service'; at: string; reason: string }[];
};

/** An event the server would not store, as reported from the phone or recorded by the server. */
export type RefusedEvent = {
  clientId: string | null;
  type: string | null;
  message: string;
  at: string;
};

/** The shop's rules the review reads (from its settings). */
export type ReviewSettings = {
  timeZone: string;
  /** % of a wrench's maximum below which it is not used. */
  wrenchFloorPercent: number;
  verification: VerificationPolicy;
  tooFastSecondsPerBolt: number;
};

export type WheelReviewInput = {
  wheelId: string;
  /** LF, RF, … — how people name the wheel. */
  position: string;
  plan: ReviewPlan;
  /** The spec's bead-seating limit and the wheel's target pressure. */
  limits: { maxBeadSeat: Pressure; targetPressure: Pressure };
  events: readonly ReviewEvent[];
  photoKinds: readonly string[];
  requiredPhotos: readonly string[];
  wrenches: readonly ReviewWrench[];
  verifications: readonly RecordedVerification[];
  refused: readonly RefusedEvent[];
  submittedAt: string | null;
  flaggedReason: string | null;
};

export type JobReviewInput = {
  wheels: readonly WheelReviewInput[];
  settings: ReviewSettings;
  assigneeId: string | null;
  /** Names of the people who appear in the record, by user id. */
  people: Readonly<Record<string, string>>;
  vinCheckOverridden: boolean;
  /** The engine's axle warnings for the job's tires as stored: any here were accepted when saved. */
  axleWarnings: readonly string[];
};

export type Severity = 'blocks' | 'notes';

export type AnomalyCode =
  | 'out_of_sequence'
  | 'too_fast'
  | 'wrench_missing'
  | 'wrench_unverified'
  | 'wrench_out_of_service'
  | 'wrench_calibration_overdue'
  | 'wrench_unsuitable'
  | 'bead_seat_over_limit'
  | 'pressure_off_target'
  | 'photo_missing'
  | 'axle_mismatch_accepted'
  | 'vin_overridden'
  | 'step_skipped'
  | 'inspection_failed'
  | 'bolt_flagged'
  | 'other_person'
  | 'events_refused'
  | 'received_after_submit';

export type Anomaly = {
  /** Stable across recomputation: what an acknowledgement points at. */
  key: string;
  code: AnomalyCode;
  severity: Severity;
  message: string;
  /** Null for the job as a whole (VIN, axle). */
  wheelId: string | null;
  pass?: number;
  bolts?: number[];
};
