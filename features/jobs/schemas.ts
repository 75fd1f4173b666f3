import { z } from 'zod';
import { PRESSURE_UNITS } from '@/features/torque-plan';
import { dateTime, queryInt, searchText } from '@/features/ui/bounded';
import {
  checkbox,
  integerField,
  optional,
  positiveNumber,
  requiredText,
  text,
} from '@/features/ui/form-data';

export const JOB_STATES = [
  'open',
  'in_progress',
  'awaiting_signoff',
  'signed_off',
  'sent_back',
] as const;
export type JobStateName = (typeof JOB_STATES)[number];
export const POSITIONS = ['LF', 'RF', 'LR', 'RR', 'spare'] as const;
export const POSITION_LABELS: Record<(typeof POSITIONS)[number], string> = {
  LF: 'Left front',
  RF: 'Right front',
  LR: 'Left rear',
  RR: 'Right rear',
  spare: 'Spare',
};
const pressureUnit = z.enum(PRESSURE_UNITS, { error: 'Choose psi, kPa or bar.' });
const uuid = (what: string) => z.uuid({ error: `Unknown ${what}.` });

export const customerSchema = z.object({
  name: requiredText("the customer's name", 120),
  phone: text('the phone number', 40)
    .regex(/^[0-9+()\-.\s]*$/, { error: 'A phone number has digits, spaces and + ( ) - only.' })
    .default(''),
  email: z
    .union([
      z.literal(''),
      z
        .string()
        .trim()
        .toLowerCase()
        .pipe(
          z
            .email({ error: 'Enter a valid e-mail address, or leave it empty.' })
            .max(254, { error: 'Keep the e-mail address under 254 characters.' }),
        ),
    ])
    .default(''),
});

export const vehicleFields = {
  year: optional(
    integerField('the year').pipe(
      z
        .number()
        .min(1950, { error: 'Enter a year from 1950 on.' })
        .max(new Date().getFullYear() + 2, { error: 'That year is in the future.' }),
    ),
  ),
  make: text('the make', 60).default(''),
  model: text('the model', 60).default(''),
  description: text('the description', 300).default(''),
  vin: optional(text('the VIN', 30)),
  vinOverride: checkbox.default(false),
};

export const vehicleSchema = z
  .object({ customerId: uuid('customer'), ...vehicleFields })
  .refine((v) => v.make || v.model || v.description, {
    error: 'Describe the vehicle: make and model, or a description.',
    path: ['make'],
  });

export const wheelSchema = z.object({
  position: z.enum(POSITIONS, { error: 'Choose LF, RF, LR, RR or spare.' }),
  specId: uuid('wheel spec'),
  tireSize: requiredText('the tire size', 30),
  directional: checkbox.default(false),
  targetPressure: positiveNumber('the target pressure'),
  pressureUnit,
});
export type WheelInput = z.infer<typeof wheelSchema>;

/** Wheels arrive as a JSON string from the job form, or as an array in a JSON body. */
const wheelsField = z.preprocess(
  (v) => {
    if (typeof v !== 'string') return v;
    try {
      return JSON.parse(v);
    } catch {
      return v;
    }
  },
  z
    .array(wheelSchema, { error: 'Add the wheels on the job.' })
    .min(1, { error: 'Add at least one wheel.' })
    .max(5),
);

const dueAt = optional(dateTime('the due date and time'));

export const jobSchema = z
  .object({
    customerId: optional(uuid('customer')),
    customer: optional(customerSchema),
    vehicleId: optional(uuid('vehicle')),
    vehicle: optional(z.object(vehicleFields)),
    wheels: wheelsField,
    dismount: checkbox.default(false),
    reinstall: checkbox.default(false),
    assigneeId: optional(uuid('assignee')),
    dueAt,
    notes: text('the notes', 2000).default(''),
    acceptAxleMismatch: checkbox.default(false),
  })
  .superRefine((j, ctx) => {
    if (!j.customerId && !j.customer)
      ctx.addIssue({
        code: 'custom',
        path: ['customerId'],
        message: 'Pick a customer or add a new one.',
      });
    if (!j.vehicleId && !j.vehicle)
      ctx.addIssue({
        code: 'custom',
        path: ['vehicleId'],
        message: 'Pick a vehicle or add a new one.',
      });
    const positions = j.wheels.map((w) => w.position);
    if (new Set(positions).size !== positions.length)
      ctx.addIssue({
        code: 'custom',
        path: ['wheels'],
        message: 'Each wheel position can be on the job once.',
      });
  });
export type JobInput = z.infer<typeof jobSchema>;

export const jobUpdateSchema = z.object({
  assigneeId: z.preprocess((v) => (v === '' ? null : v), uuid('assignee').nullable()).optional(),
  dueAt: z
    .preprocess((v) => (v === '' ? null : v), dateTime('the due date and time').nullable())
    .optional(),
  notes: text('the notes', 2000).optional(),
  dismount: checkbox.optional(),
  reinstall: checkbox.optional(),
});

export const TRANSITIONS = ['start', 'submit', 'sign_off', 'send_back'] as const;
/** One wheel a lead sends back: its own note, and the runner steps to redo (none named = the whole wheel). */
export const sendBackWheelSchema = z.object({
  wheelId: uuid('wheel'),
  note: requiredText('the note for this wheel', 1000),
  steps: z
    .array(z.string().regex(/^[a-z_]{1,20}$/, { error: 'Unknown step.' }), {
      error: 'Name the steps as a list.',
    })
    .max(12)
    .default([]),
});

export const transitionSchema = z.object({
  action: z.enum(TRANSITIONS, { error: 'Unknown action.' }),
  note: text('the note', 1000).default(''),
  /** With send_back: the wheels to redo. Left out, every wheel of the job reopens with the job's note. */
  wheels: z.array(sendBackWheelSchema, { error: 'Send the wheels as a list.' }).max(5).optional(),
});
export type SendBackWheel = z.infer<typeof sendBackWheelSchema>;

export const boardQuerySchema = z.object({
  state: optional(
    z
      .string()
      .max(200)
      .transform((s) => s.split(',').filter(Boolean))
      .pipe(z.array(z.enum(JOB_STATES, { error: 'Unknown job state.' }))),
  ),
  assignee: optional(
    z.union([z.literal('me'), z.literal('unassigned'), z.uuid()], {
      error: 'Assignee is me, unassigned or a member id.',
    }),
  ),
  due: optional(z.enum(['overdue', 'today', 'week'], { error: 'Due is overdue, today or week.' })),
  q: searchText(),
  sort: z
    .enum(['due', 'number', 'state', 'customer', 'updated'], {
      error: 'Sort by due, number, state, customer or updated.',
    })
    .default('due'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  page: queryInt('the page', { min: 1, max: 100_000 }, 1),
  pageSize: queryInt('the page size', { min: 1, max: 100 }, 25),
});
export type BoardQuery = z.infer<typeof boardQuerySchema>;

export const ids = {
  job: uuid('job card'),
  wheel: uuid('wheel'),
  customer: uuid('customer'),
  vehicle: uuid('vehicle'),
};
