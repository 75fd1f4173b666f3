import type { WheelSnapshot } from '@/db/schema';
import type { Pressure, Torque, TorqueUnit } from '@/features/torque-plan';

/** One stored runner event of a wheel that still counts (send-back's superseded events left out). */
export type ReportEvent = {
  clientId: string;
  type: string;
  payload: Record<string, unknown>;
  byId: string;
  clientAt: string;
};

export type ReportPhoto = { id: string; wheelId: string; kind: string; note: string; at: string };

export type ReportWheelData = {
  id: string;
  position: string;
  tireSize: string;
  directional: boolean;
  targetPressure: Pressure;
  /** Frozen when the run started; the report reads the spec from here, never the spec's current row. */
  snapshot: WheelSnapshot | null;
  submittedAt: string | null;
  submittedById: string | null;
  events: ReportEvent[];
  photos: ReportPhoto[];
};

export type ReportWrench = {
  label: string;
  kind: string;
  serial: string;
  unit: TorqueUnit;
  graduation: number;
  /** The last verification recorded before the job was signed off. */
  lastVerification: { at: string; reference: Torque; withinTolerance: boolean } | null;
};

/** Everything the report shows, read from the shop's own rows; the view model makes it readable. */
export type ReportData = {
  shop: { name: string; contact: string | null };
  timeZone: string;
  recheckDays: number;
  job: {
    id: string;
    number: number;
    state: string;
    createdAt: string;
    dismount: boolean;
    reinstall: boolean;
    customer: { name: string; email: string; phone: string };
    vehicle: {
      year: number | null;
      make: string;
      model: string;
      description: string;
      vin: string | null;
    };
  };
  signOff: { byId: string; at: string; selfSignoff: boolean } | null;
  /** The queued reminder's day when one exists (it may have been rescheduled). */
  recheck: { dueOn: string; status: string } | null;
  wheels: ReportWheelData[];
  acknowledgements: {
    wheelId: string | null;
    message: string;
    reason: string;
    byId: string;
    at: string;
  }[];
  people: Record<string, string>;
  wrenches: Record<string, ReportWrench>;
};
