/**
 * The procedure for one wheel, as the runner's screens. Pure data: the runner, the API and
 * practice mode read the same list. Cautions are best practice (OSHA 29 CFR 1910.177 covers rim
 * wheels of large vehicles; bolted wheels without a lock ring may fall outside its letter).
 */
export type StepId =
  | 'safety'
  | 'dismount'
  | 'inspect'
  | 'clean'
  | 'mount'
  | 'index'
  | 'hand_start'
  | 'torque'
  | 'seat_bead'
  | 'leak_check'
  | 'reinstall'
  | 'submit';

export type Step = {
  id: StepId;
  title: string;
  cautions: string[];
  checklist: { id: string; text: string }[];
  /** A reading to record, in pressure units. */
  measurement?: { label: string; kind: 'pressure' };
  /** Photos this step asks for. */
  photos?: { kind: 'bead_outer' | 'bead_inner'; label: string }[];
  /** The step cannot be skipped (safety, the passes, the bead). */
  required?: boolean;
};

export const MAKER_FIRST = "The wheel and tire maker's specs, local codes and licensed practice come first.";

const ALL: Step[] = [
  {
    id: 'safety',
    title: 'Safety gate',
    required: true,
    cautions: ['Deflate completely with the valve core out before any ring bolt is loosened (OSHA 1910.177(f)).', 'No heat or welding on wheel parts.'],
    checklist: [
      { id: 'off-vehicle', text: 'The wheel is off the vehicle.' },
      { id: 'deflated', text: 'The tire is fully deflated.' },
      { id: 'core-out', text: 'The valve core is removed.' },
    ],
  },
  {
    id: 'dismount',
    title: 'Dismount',
    cautions: ['Loosen ring bolts only on a fully deflated tire.'],
    checklist: [
      { id: 'bolts-out', text: 'All ring bolts removed.' },
      { id: 'inner-bead', text: 'Inner bead broken.' },
      { id: 'tire-off', text: 'Old tire worked off the wheel.' },
    ],
  },
  {
    id: 'inspect',
    title: 'Inspect rim and ring',
    required: true,
    cautions: ['Inspect every component and tag unserviceable ones before assembly (OSHA 1910.177(f)). A cracked, bent or burred part stops the wheel.'],
    checklist: [
      { id: 'no-cracks', text: 'No cracks in the rim or the ring.' },
      { id: 'no-bends', text: 'No bends in the ring or the bead seat.' },
      { id: 'faces-clean', text: 'No burrs on the sealing faces.' },
      { id: 'threads-ok', text: 'No damaged threads.' },
    ],
  },
  {
    id: 'clean',
    title: 'Clean',
    checklist: [
      { id: 'holes-blown', text: 'Threaded holes cleared and blown out.' },
      { id: 'ring-clean', text: 'Ring cleaned on both faces.' },
    ],
    cautions: [],
  },
  {
    id: 'mount',
    title: 'Mount the tire',
    cautions: [],
    checklist: [
      { id: 'lubed', text: 'Bead lubricated.' },
      { id: 'fitted', text: 'Tire fitted on the wheel.' },
      { id: 'direction', text: 'Rotation arrow checked for this side (directional tires).' },
    ],
  },
  {
    id: 'index',
    title: 'Index the ring',
    cautions: [],
    checklist: [{ id: 'notch', text: "The ring's valve notch lines up with the valve stem." }],
  },
  {
    id: 'hand_start',
    title: 'Start every bolt by hand',
    required: true,
    cautions: ['Start each bolt a few threads by hand. If one binds, back it out and retry: never force a cross-threaded bolt.'],
    checklist: [],
  },
  {
    id: 'torque',
    title: 'Torque passes',
    required: true,
    cautions: ['Follow the sequence on the bolt circle. Never inflate until every bolt has been checked at final torque.'],
    checklist: [],
  },
  {
    id: 'seat_bead',
    title: 'Seat the bead',
    required: true,
    cautions: [
      'Restrain the tire in a cage or with a strap before inflating (OSHA 1910.177(d)).',
      'Use a clip-on chuck and an in-line gauge or regulator; stand outside the trajectory and never lean on the restraint.',
      "Never exceed the tire's maximum bead-seating pressure. If the beads have not seated by then, stop, deflate and find the cause.",
      'No flammables to seat a bead.',
    ],
    checklist: [
      { id: 'restrained', text: 'Tire restrained (cage or strap).' },
      { id: 'clip-chuck', text: 'Clip-on chuck; standing clear of the wheel.' },
      { id: 'seated', text: 'Both beads seated.' },
    ],
    measurement: { label: 'Highest pressure used to seat the bead', kind: 'pressure' },
    photos: [
      { kind: 'bead_outer', label: 'Seated bead, outer face' },
      { kind: 'bead_inner', label: 'Seated bead, inner face' },
    ],
  },
  {
    id: 'leak_check',
    title: 'Leak check and pressure',
    cautions: [],
    checklist: [
      { id: 'soapy', text: 'Soapy-water check: no bubbles at the ring, the valve or the bead.' },
      { id: 'core-in', text: 'Valve core back in.' },
    ],
    measurement: { label: 'Pressure set', kind: 'pressure' },
  },
  {
    id: 'reinstall',
    title: 'Re-install on the vehicle',
    cautions: ["Lug nuts in a star pattern to the vehicle maker's lug torque."],
    checklist: [
      { id: 'star', text: 'Lug nuts run down in a star pattern.' },
      { id: 'lug-torque', text: 'Lug nuts torqued to spec.' },
    ],
  },
  { id: 'submit', title: 'Submit the wheel', required: true, cautions: [], checklist: [] },
];

/** The steps of this wheel's job: dismount and re-install only when the job includes them. */
export function stepsFor(job: { dismount: boolean; reinstall: boolean }): Step[] {
  return ALL.filter((s) => (s.id !== 'dismount' || job.dismount) && (s.id !== 'reinstall' || job.reinstall));
}

export const REQUIRED_PHOTOS = ['bead_outer', 'bead_inner'] as const;
