/**
 * The procedure for one wheel, as the runner's screens. Pure data: the runner, the API and
 * practice mode read the same list. Cautions are best practice (OSHA 29 CFR 1910.177 covers rim
 * wheels of large vehicles; bolted wheels without a lock ring may fall outside its letter).
 */
/** Every step, in procedure order: the one list events, the runner and the review name steps from. */
export const STEP_IDS = [
  'safety',
  'dismount',
  'clean',
  'inspect',
  'mount',
  'index',
  'hand_start',
  'torque',
  'seat_bead',
  'leak_check',
  'reinstall',
  'submit',
] as const;
export type StepId = (typeof STEP_IDS)[number];

export type Step = {
  id: StepId;
  title: string;
  cautions: string[];
  checklist: { id: string; text: string }[];
  /** A reading to record, in pressure units. */
  measurement?: { label: string; kind: 'pressure' };
  /** The step cannot be skipped (safety, the passes, the bead). */
  required?: boolean;
};

export const MAKER_FIRST =
  "The wheel and tire maker's specs, local codes and licensed practice come first.";

const ALL: Step[] = [
  {
    id: 'safety',
    title: 'Safety gate',
    required: true,
    cautions: [
      'Deflate completely with the valve core out before any ring bolt is loosened (OSHA 1910.177(f)).',
      'No heat or welding on wheel parts.',
    ],
    checklist: [
      { id: 'off-vehicle', text: 'The wheel is off the vehicle.' },
      { id: 'deflated', text: 'The tire is fully deflated.' },
      { id: 'core-out', text: 'The valve core is removed.' },
    ],
  },
  {
    id: 'dismount',
    title: 'Dismount',
    cautions: [
      'Ring bolts come out only with the tire flat and the valve core out.',
      'Lubricate the bead edge before you work it off: a dry bead tears and fights you.',
      "Breaking the bead with a jack and a bar against a fixed point: keep your hands and face out of the bar's path. When the bead lets go, the bar jumps.",
    ],
    checklist: [
      { id: 'bolts-out', text: 'All ring bolts out, ring lifted off.' },
      { id: 'inner-bead', text: 'Inner bead broken.' },
      { id: 'tire-off', text: 'Old tire worked off the wheel.' },
    ],
  },
  {
    id: 'clean',
    title: 'Clean and deburr',
    cautions: [
      'Take the burrs off the sealing faces with a fine file or a wire wheel: the burr only, never cut into the sealing face itself. Eye protection on. A burr left here leaks or cuts the bead.',
    ],
    checklist: [
      { id: 'faces-deburred', text: 'Rim sealing faces cleaned and deburred.' },
      { id: 'ring-clean', text: 'Ring cleaned and deburred on both faces.' },
      { id: 'holes-blown', text: 'Threaded holes cleaned and blown out.' },
    ],
  },
  {
    id: 'inspect',
    title: 'Inspect rim, ring and bolts',
    required: true,
    cautions: [
      'Look at every part before it goes back together and tag anything unserviceable (OSHA 1910.177(f)). A cracked or bent part, or a thread that will not take a bolt, stops the wheel.',
      "Ring bolts that are stretched, galled or have damaged heads get replaced, with the maker's bolt. Never re-use one you would not bet the ring on.",
    ],
    checklist: [
      { id: 'no-cracks', text: 'No cracks in the rim or the ring.' },
      { id: 'no-bends', text: 'No bends in the ring or the bead seat.' },
      { id: 'threads-ok', text: 'No damaged threads in the rim.' },
      {
        id: 'bolts-ok',
        text: 'Ring bolts checked: stretched, galled or damaged heads replaced per the maker.',
      },
    ],
  },
  {
    id: 'mount',
    title: 'Mount the tire',
    cautions: [
      'The outer bead must sit centred on the lock seat all the way round before the ring goes on. A bead pinched under the ring will not seal and can let go.',
    ],
    checklist: [
      { id: 'lubed', text: 'Bead lubricated.' },
      { id: 'fitted', text: 'Tire fitted on the wheel.' },
      { id: 'outer-centred', text: 'Outer bead centred on the lock seat, all the way round.' },
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
    cautions: [
      'Start each bolt a few threads by hand, across the ring as suggested. If one binds, back it out and start it again: never drive a cross-threaded bolt with a tool.',
      'Lubricate the bolts only as the wheel maker says. Dry, oiled or anti-seize changes what the wrench setting puts into the bolt.',
    ],
    checklist: [],
  },
  {
    id: 'torque',
    title: 'Torque passes',
    required: true,
    cautions: [
      'Follow the sequence on the bolt circle, one pass at a time, at the setting shown. No air goes in until every bolt has been checked at final torque.',
    ],
    checklist: [],
  },
  {
    id: 'seat_bead',
    title: 'Seat the bead',
    required: true,
    cautions: [
      'The tread strap squeezes the tire so the air pushes the inner bead out to its seat. It helps the bead seat; it is not a restraint.',
      'Inflate inside a cage or restraining device where the rules call for one (OSHA 1910.177(d) for the rim wheels it covers). Never lean on it or rest a hand on it while air goes in.',
      'Outside a restraint, put in only enough air to seat the bead (OSHA 1910.177(f)), then carry on.',
      'Clip-on chuck, an in-line gauge, and you stand clear of the trajectory: never over the wheel, never in line with the ring.',
      "Never go past the tire's maximum bead-seating pressure. If the bead has not seated by then, stop, let the air out and find out why.",
      'Take the strap off as soon as the bead has seated, before you finish inflating.',
      'No flammables to seat a bead.',
    ],
    checklist: [
      { id: 'strap', text: 'Strap on the tread to help the bead seat.' },
      { id: 'restrained', text: 'Cage or restraining device used where the rules call for one.' },
      {
        id: 'clip-chuck',
        text: 'Clip-on chuck and in-line gauge; standing clear of the trajectory.',
      },
      { id: 'seated', text: 'Inner bead seated.' },
      { id: 'strap-off', text: 'Strap off before finishing inflation.' },
      { id: 'ring-gap', text: 'Ring gap even all round.' },
    ],
    measurement: { label: 'Highest pressure used to seat the bead', kind: 'pressure' },
  },
  {
    id: 'leak_check',
    title: 'Leak check and pressure',
    cautions: ['Valve core in first, then inflate to the target from outside the trajectory.'],
    checklist: [
      { id: 'core-in', text: 'Valve core back in.' },
      { id: 'inflated', text: "Inflated to the wheel's target pressure." },
      { id: 'soapy', text: 'Soapy-water check: no bubbles at the ring, the bead or the valve.' },
    ],
    measurement: { label: 'Pressure set', kind: 'pressure' },
  },
  {
    id: 'reinstall',
    title: 'Re-install on the vehicle',
    cautions: [
      "Lug nuts run down in a star pattern, then torqued to the vehicle maker's lug torque with a checked wrench. Re-torque after the first miles as the maker says.",
    ],
    checklist: [
      { id: 'star', text: 'Lug nuts run down in a star pattern.' },
      { id: 'lug-torque', text: 'Lug nuts torqued to spec.' },
    ],
  },
  { id: 'submit', title: 'Submit the wheel', required: true, cautions: [], checklist: [] },
];

/** The steps of this wheel's job: dismount and re-install only when the job includes them. */
export function stepsFor(job: { dismount: boolean; reinstall: boolean }): Step[] {
  return ALL.filter(
    (s) => (s.id !== 'dismount' || job.dismount) && (s.id !== 'reinstall' || job.reinstall),
  );
}
