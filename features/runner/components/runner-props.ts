import type {
  PressureUnit,
  RecordedVerification,
  Torque,
  WheelPosition,
} from '@/features/torque-plan';
import type { SaveEvents } from '../api/use-run-queue';
import type { BackLink } from '../back-link';
import type { ClientEvent } from '../events';
import type { RunnerPractice } from '../practice-mode';
import type { RunnerPlan } from '../state';
import type { CribWrench, WrenchRules } from '../wrench-gate';
import type { Photo } from './photo-capture';
import type { SpecWords } from './spec-words';

/** What the runner page hands the runner (and practice hands it for a simulated wheel). */
export type RunnerProps = {
  jobId: string;
  jobNumber: number;
  wheel: {
    id: string;
    position: WheelPosition;
    tireSize: string;
    directional: boolean;
    targetPressure: number;
    pressureUnit: PressureUnit;
  };
  spec: {
    name: string;
    maxBeadSeatPressure: number;
    pressureUnit: PressureUnit;
    lugTorque: string | null;
    /** The lug torque and lug count for re-install (the snapshot's), when the spec has them. */
    lug?: { torque: Torque | null; count: number | null };
    /** The spec's own words, shown at hand-start and with the first pass. */
    words?: SpecWords;
  };
  plan: RunnerPlan;
  targets: Torque[];
  wrenches: CribWrench[];
  /** Recent passing verifications; the shop's policy (in `rules`) decides per pass which count. */
  verifications: RecordedVerification[];
  /** The shop's wrench floor and verification policy. */
  rules: WrenchRules;
  events: ClientEvent[];
  photos: Photo[];
  /**
   * How confirmed events are sent: `postWheelEvents` for a real wheel (WheelRunner),
   * practice's `postPracticeEvents` for an attempt. Required, so a page cannot send an attempt's
   * events to a wheel's address by leaving it out.
   */
  saveEvents: SaveEvents;
  /** Sign-in that comes back to this runner, for when the session ends mid-wheel. */
  signInHref: string;
  /** A lead sent this wheel back: their note, and the steps to redo (none = the whole wheel). */
  rework?: { note: string; steps: string[]; at: string } | null;
  /** Who is signed in: the phone keeps each person's outbox apart and never sends one under another's name. */
  person: { id: string; name: string };
  /** The header's "←" (runnerBackLink): the job card, or My wheels for someone who may not open it. */
  back?: BackLink;
  /** Whether this person may record a wrench verification on the spot (verifications.record). */
  mayRecordVerifications?: boolean;
  /** Practice mode: a simulated wheel; photos optional, Finish instead of Submit (see RunnerPractice). */
  practice?: RunnerPractice;
};
