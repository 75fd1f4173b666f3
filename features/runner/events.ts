import { z } from 'zod';
import { PRESSURE_UNITS } from '@/features/torque-plan';

const step = z.enum(['safety', 'dismount', 'inspect', 'clean', 'mount', 'index', 'hand_start', 'torque', 'seat_bead', 'leak_check', 'reinstall', 'submit']);
const bolt = z.number().int().min(1).max(64);
const pass = z.number().int().min(1).max(10);

/** Every kind of event the runner sends; the server validates each against this. */
export const runEventSchema = z.discriminatedUnion(
  'type',
  [
    z.object({ type: z.literal('step_done'), payload: z.object({ step, checklist: z.array(z.string().max(40)).max(20).default([]), measurement: z.object({ value: z.number().positive().max(10_000), unit: z.enum(PRESSURE_UNITS) }).optional() }) }),
    z.object({ type: z.literal('step_skipped'), payload: z.object({ step, reason: z.string().trim().min(3, { error: 'Say why the step is skipped.' }).max(300) }) }),
    z.object({ type: z.literal('inspection_failed'), payload: z.object({ notes: z.string().trim().min(3, { error: 'Say what failed.' }).max(500) }) }),
    z.object({ type: z.literal('hand_started'), payload: z.object({ bolt }) }),
    z.object({ type: z.literal('hand_unstarted'), payload: z.object({ bolt }) }),
    z.object({ type: z.literal('wrench_chosen'), payload: z.object({ pass, wrenchId: z.uuid() }) }),
    z.object({ type: z.literal('bolt_confirmed'), payload: z.object({ pass, bolt }) }),
    z.object({ type: z.literal('bolt_undone'), payload: z.object({ pass, bolt }) }),
  ],
  { error: 'Unknown runner event.' },
);

export const clientEventSchema = z.intersection(
  runEventSchema,
  z.object({ clientId: z.uuid({ error: 'Each event needs its own id.' }), clientAt: z.iso.datetime({ error: 'Each event needs the time it happened.' }) }),
);

export const eventBatchSchema = z.object({ events: z.array(clientEventSchema).min(1).max(200, { error: 'At most 200 events at once.' }) });

export type RunEvent = z.infer<typeof runEventSchema>;
export type ClientEvent = z.infer<typeof clientEventSchema>;
