import { addDays, formatShopDay, formatShopTime, shopDay } from '@/features/ui/shop-time';
import type { ReportData } from './types';
import { wheelView, type WheelView } from './wheel-view';

export type ReportView = {
  shop: { name: string; contact: string | null };
  jobNumber: number;
  customer: string;
  vehicle: string;
  vin: string;
  openedOn: string;
  signedOff: { by: string; at: string; selfSignoff: boolean } | null;
  workedBy: string[];
  summary: string;
  wheels: WheelView[];
  acknowledgements: { wheel: string; message: string; reason: string; by: string; at: string }[];
  recheck: { dueOn: string; day: string; what: string[] } | null;
  cautions: string[];
  makerFirst: string;
};

/** Said on the report, the page and the e-mail alike. */
export const MAKER_FIRST =
  "This record shows what was done in our shop. The wheel and tire maker's specifications, local codes and licensed practice always come first; nothing here replaces them.";

export const RECHECK_WHAT = [
  'Every ring bolt re-torqued to the final torque on this report, in the same order, with a checked wrench.',
  'Tire pressure checked cold and set to the target.',
  'A look at the ring gap all round and for any leak at the ring, the bead and the valve.',
];

export const CAUTIONS = [
  'Ring bolts settle as the tire flexes: have them re-checked after the first ride, and before any hard use.',
  'Never loosen a ring bolt with air in the tire: deflate completely and take the valve core out first.',
  'Never inflate past the bead-seating limit shown for the wheel, and stand clear of the tire while inflating.',
  'A wheel with a cracked ring, a damaged thread or a stretched bolt must not go back on the vehicle.',
];

export function vehicleLabel(v: ReportData['job']['vehicle']): string {
  return [v.year, v.make, v.model].filter(Boolean).join(' ') || v.description || 'Vehicle';
}

/** The day the ring bolts are due for their re-check: the queued reminder's, else sign-off day + the shop's re-check days. */
export function recheckDay(data: ReportData): string | null {
  if (data.recheck) return data.recheck.dueOn;
  if (!data.signOff) return null;
  return addDays(shopDay(data.signOff.at, data.timeZone), data.recheckDays);
}

/** What the report says, in the shop's time zone and words; pure, so it is tested without a PDF. */
export function reportView(data: ReportData): ReportView {
  const tz = data.timeZone;
  const name = (id: string) => data.people[id] ?? 'a former team member';
  const wheels = data.wheels.map((w) =>
    wheelView(w, { timeZone: tz, people: data.people, wrenches: data.wrenches }),
  );
  const positionOf = new Map(data.wheels.map((w) => [w.id, w.position]));
  const due = recheckDay(data);
  const workedBy = [...new Set(wheels.flatMap((w) => w.workedBy))];
  const positions = wheels.map((w) => w.position).join(', ');
  const torques = [...new Set(wheels.flatMap((w) => (w.spec ? [w.spec.finalTorque] : [])))];
  return {
    shop: data.shop,
    jobNumber: data.job.number,
    customer: data.job.customer.name,
    vehicle: vehicleLabel(data.job.vehicle),
    vin: data.job.vehicle.vin || 'not recorded',
    openedOn: formatShopTime(data.job.createdAt, tz, 'date'),
    signedOff: data.signOff
      ? {
          by: name(data.signOff.byId),
          at: formatShopTime(data.signOff.at, tz),
          selfSignoff: data.signOff.selfSignoff,
        }
      : null,
    workedBy,
    summary:
      `${wheels.length} wheel${wheels.length === 1 ? '' : 's'} (${positions}) ` +
      `${data.job.dismount ? (wheels.length === 1 ? 'had a new tire mounted' : 'had new tires mounted') : wheels.length === 1 ? 'was serviced' : 'were serviced'} on the beadlock rings, ` +
      `with the ring bolts torqued in staged passes to ${torques.join(' and ') || 'the spec'}` +
      (wheels.some((w) => w.passes.some((p) => p.kind.startsWith('Check')))
        ? ' and checked until no bolt turned; '
        : '; ') +
      'the beads were seated and the pressures set.',
    wheels,
    acknowledgements: data.acknowledgements.map((a) => ({
      wheel: a.wheelId ? (positionOf.get(a.wheelId) ?? 'Wheel') : 'Job',
      message: a.message,
      reason: a.reason,
      by: name(a.byId),
      at: formatShopTime(a.at, tz),
    })),
    recheck: due ? { dueOn: formatShopDay(due), day: due, what: RECHECK_WHAT } : null,
    cautions: CAUTIONS,
    makerFirst: MAKER_FIRST,
  };
}
