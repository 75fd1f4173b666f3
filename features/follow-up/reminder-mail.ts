import { convertTorque, formatTorque, type Torque, type TorqueUnit } from '@/features/torque-plan';

export type ReminderWheel = {
  position: string;
  boltCount: number;
  sequence: number[];
  finalTorque: Torque;
  makerReference: string;
};

export type ReminderFacts = {
  shopName: string;
  customer: string;
  vehicle: string;
  jobNumber: number;
  dueOn: string;
  /** The day shown to the reader, already formatted for the shop. */
  dueText: string;
  wheels: ReminderWheel[];
  /** Set when the customer has no address and the shop's leads get the reminder instead. */
  forShop?: boolean;
};

const escape = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

const OTHER_UNIT: Record<TorqueUnit, TorqueUnit> = { 'lbf-ft': 'Nm', 'lbf-in': 'Nm', Nm: 'lbf-ft' };

/** A torque in its own unit and the other common one: "60 ft-lb (81.3 N·m)". */
export function bothUnits(t: Torque): string {
  const other = OTHER_UNIT[t.unit];
  return `${formatTorque(t)} (${formatTorque({ value: convertTorque(t.value, t.unit, other), unit: other })})`;
}

function wheelLine(w: ReminderWheel): string {
  const maker = w.makerReference ? `; maker's reference: ${w.makerReference}` : '';
  return `${w.position}: all ${w.boltCount} ring bolts at ${bothUnits(w.finalTorque)}, in this order: ${w.sequence.join('-')}${maker}`;
}

const CAUTION =
  "Check them cold, before the next ride. Any bolt that turns is brought up to the final torque, then go round again until a full lap turns nothing. A bolt that is stretched or cracked, or won't come up to torque, is replaced before the wheel rolls again: don't ride on it. The wheel and tire maker's specs, local codes and licensed practice come first; where they say otherwise, follow them.";

/** The re-check reminder: which bolts, at what torque, in which order, and the caution. */
export function recheckReminderMail(f: ReminderFacts) {
  const subject = f.forShop
    ? `Re-check due: job ${f.jobNumber} (${f.customer}, ${f.vehicle}) — no customer e-mail on file`
    : `${f.shopName}: time to re-check the ring bolts on your ${f.vehicle}`;
  const opening = f.forShop
    ? `The ring-bolt re-check for job ${f.jobNumber} (${f.customer}, ${f.vehicle}) is due ${f.dueText}. The customer has no e-mail address on file: give them a call.`
    : `Your ${f.vehicle} had its beadlock tires mounted at ${f.shopName} (job ${f.jobNumber}). After the first ride, ring bolts settle: the re-check is due ${f.dueText}.`;
  const text = [
    opening,
    '',
    'What to re-check: every ring bolt, at the final torque, in the tightening sequence (bolt 1 is the first bolt clockwise past the valve notch):',
    ...f.wheels.map((w) => `- ${wheelLine(w)}`),
    '',
    CAUTION,
    '',
    f.forShop
      ? `${f.shopName} (Ringpass)`
      : `Bring it to ${f.shopName}, or have a qualified shop do it.`,
  ].join('\n');
  const html = `<p>${escape(opening)}</p>
<p><strong>What to re-check:</strong> every ring bolt, at the final torque, in the tightening sequence (bolt 1 is the first bolt clockwise past the valve notch):</p>
<ul>${f.wheels.map((w) => `<li>${escape(wheelLine(w))}</li>`).join('')}</ul>
<p>${escape(CAUTION)}</p>
<p>${escape(f.forShop ? `${f.shopName} (Ringpass)` : `Bring it to ${f.shopName}, or have a qualified shop do it.`)}</p>`;
  return { subject, text, html };
}
