import { z } from 'zod';
import { PRESSURE_UNITS, TORQUE_UNITS } from '@/features/torque-plan';
import { cleanString, isoDateTime } from '@/features/ui/bounded';
import { BOLT_PROBLEMS, MAX_CHECK_PASSES } from './event-constants';
import { STEP_IDS } from './steps';

export {
  BOLT_PROBLEMS,
  boltFlagReason,
  MAX_CHECK_PASSES,
  type BoltProblem,
} from './event-constants';

const step = z.enum(STEP_IDS);
const bolt = z.number().int().min(1).max(64);
// A plan has at most 8 staged passes and one check pass; added check passes follow it.
const pass = z
  .number()
  .int()
  .min(1)
  .max(8 + MAX_CHECK_PASSES);
const torque = z.object({ value: z.number().positive().max(100_000), unit: z.enum(TORQUE_UNITS) });

/** Every kind of event the runner sends; the server validates each against this. */
export const runEventSchema = z.discriminatedUnion(
  'type',
  [
    z.object({
      type: z.literal('step_done'),
      payload: z.object({
        step,
        checklist: z.array(cleanString('a checklist item', 40)).max(20).default([]),
        measurement: z
          .object({ value: z.number().positive().max(10_000), unit: z.enum(PRESSURE_UNITS) })
          .optional(),
      }),
    }),
    z.object({
      type: z.literal('step_skipped'),
      payload: z.object({
        step,
        reason: cleanString('the reason', 300).min(3, { error: 'Say why the step is skipped.' }),
      }),
    }),
    z.object({
      type: z.literal('inspection_failed'),
      payload: z.object({
        notes: cleanString('the notes', 500).min(3, { error: 'Say what failed.' }),
      }),
    }),
    z.object({ type: z.literal('hand_started'), payload: z.object({ bolt }) }),
    z.object({ type: z.literal('hand_unstarted'), payload: z.object({ bolt }) }),
    z.object({ type: z.literal('wrench_chosen'), payload: z.object({ pass, wrenchId: z.uuid() }) }),
    // `wrenchId` and `setting`: the wrench and the setting the runner showed when the bolt was
    // confirmed (older phones sent neither; such events still count). The server adds `target`,
    // the pass's target from the wheel's snapshot, when it stores the event.
    // `turned` (check passes only): whether the bolt turned before the wrench clicked; any bolt
    // that turned adds another check pass.
    z.object({
      type: z.literal('bolt_confirmed'),
      payload: z.object({
        pass,
        bolt,
        wrenchId: z.uuid().optional(),
        setting: torque.optional(),
        turned: z.boolean().optional(),
      }),
    }),
    z.object({ type: z.literal('bolt_undone'), payload: z.object({ pass, bolt }) }),
    // A bolt that stops the wheel (during hand-start `pass` is absent): the wheel is flagged for a lead.
    z.object({
      type: z.literal('bolt_flagged'),
      payload: z
        .object({
          bolt,
          pass: pass.optional(),
          problem: z.enum(BOLT_PROBLEMS, { error: 'Choose what is wrong with the bolt.' }),
          note: cleanString('the note', 300).optional(),
          photoId: z.uuid().optional(),
        })
        .refine((p) => p.problem !== 'other' || (p.note?.trim().length ?? 0) >= 3, {
          error: 'Say what is wrong with the bolt.',
          path: ['note'],
        }),
    }),
  ],
  { error: 'Unknown runner event.' },
);

export const clientEventSchema = z.intersection(
  runEventSchema,
  // `deviceId`: the phone's own id (optional: events queued before phones kept one still save).
  z.object({
    clientId: z.uuid({ error: 'Each event needs its own id.' }),
    clientAt: isoDateTime('the time it happened'),
    deviceId: z.uuid({ error: 'The phone id is not valid.' }).optional(),
  }),
);

export const eventBatchSchema = z.object({
  events: z.array(clientEventSchema).min(1).max(200, { error: 'At most 200 events at once.' }),
});

export type RunEvent = z.infer<typeof runEventSchema>;

export type ClientEvent = z.infer<typeof clientEventSchema>;

/** One event the server would not take, by its place in the batch the phone sent. */
export type EventRefusal = {
  index: number;
  clientId: string | null;
  message: string;
  fieldErrors: Record<string, string[]>;
};

/** What the phone sends: the events are judged one by one, so one bad event cannot hold up the rest. */
export const looseEventBatchSchema = z.object({
  events: z
    .array(z.unknown(), { error: 'Send the events as a list.' })
    .min(1, { error: 'Send at least one event.' })
    .max(200, { error: 'At most 200 events at once.' }),
});

const idOf = (raw: unknown) => {
  const id = raw && typeof raw === 'object' ? (raw as { clientId?: unknown }).clientId : undefined;
  return typeof id === 'string' && id.length <= 100 ? id : null;
};

/** Splits a batch into the events that pass the schema and a refusal (with its field errors) for each that does not. */
export function partitionEvents(raw: unknown[]): {
  events: ClientEvent[];
  refused: EventRefusal[];
} {
  const events: ClientEvent[] = [];
  const refused: EventRefusal[] = [];
  raw.forEach((item, index) => {
    const parsed = clientEventSchema.safeParse(item);
    if (parsed.success) return void events.push(parsed.data);
    const fieldErrors: Record<string, string[]> = {};
    for (const issue of parsed.error.issues)
      (fieldErrors[issue.path.join('.') || 'event'] ??= []).push(issue.message);
    refused.push({
      index,
      clientId: idOf(item),
      message: parsed.error.issues[0]?.message ?? 'This event is not valid.',
      fieldErrors,
    });
  });
  return { events, refused };
}
