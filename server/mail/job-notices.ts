import 'server-only';
import { and, eq, inArray, isNull, ne } from 'drizzle-orm';
import { getDb } from '@/db';
import { customers, jobs, jobWheels, users, vehicles } from '@/db/schema';
import { env } from '@/server/env.mjs';
import { sendJob } from '@/server/queue/boss';
import { sendMail, type OutgoingMail } from './mailer';

const escape = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );
const stepWords = (steps: readonly string[]) => steps.map((s) => s.replaceAll('_', ' ')).join(', ');

type JobFacts = { number: number; customer: string; vehicle: string };
const jobLine = (j: JobFacts) => `job ${j.number} (${j.customer}, ${j.vehicle})`;

/** To a lead: a job card waits for sign-off. Plain text and HTML say the same. */
export function awaitingSignoffMail(p: JobFacts & { by: string; link: string }) {
  const subject = `Job ${p.number} is waiting for sign-off`;
  const text = [
    `${p.by} submitted ${jobLine(p)} for sign-off.`,
    '',
    `Review it: ${p.link}`,
    '',
    'The review lists first what needs a lead’s look: anomalies that block sign-off must be acknowledged with a reason.',
  ].join('\n');
  const html = `<p>${escape(p.by)} submitted <strong>${escape(jobLine(p))}</strong> for sign-off.</p>
<p><a href="${escape(p.link)}">Review job ${p.number}</a></p>
<p>The review lists first what needs a lead’s look: anomalies that block sign-off must be acknowledged with a reason.</p>`;
  return { subject, text, html };
}

/** To the technician: which wheels came back and what to redo on each. */
export function sentBackMail(
  p: JobFacts & {
    by: string;
    link: string;
    wheels: { position: string; note: string; steps: string[] }[];
  },
) {
  const positions = p.wheels.map((w) => w.position).join(', ');
  const subject = `Job ${p.number} was sent back: ${positions}`;
  const redo = p.wheels.map(
    (w) =>
      `${w.position} wheel: ${w.note}${w.steps.length ? ` (redo: ${stepWords(w.steps)})` : ' (redo the whole wheel)'}`,
  );
  const text = [
    `${p.by} sent ${jobLine(p)} back.`,
    '',
    ...redo,
    '',
    `Open the job card: ${p.link}`,
    '',
    'The note is also at the top of the runner for each wheel.',
  ].join('\n');
  const html = `<p>${escape(p.by)} sent <strong>${escape(jobLine(p))}</strong> back.</p>
<ul>${p.wheels.map((w) => `<li><strong>${escape(w.position)} wheel:</strong> ${escape(w.note)} ${w.steps.length ? `(redo: ${escape(stepWords(w.steps))})` : '(redo the whole wheel)'}</li>`).join('')}</ul>
<p><a href="${escape(p.link)}">Open job ${p.number}</a></p>
<p>The note is also at the top of the runner for each wheel.</p>`;
  return { subject, text, html };
}

export type TransitionNotice = {
  shopId: string;
  jobId: string;
  action: string;
  byId: string;
  wheels?: { wheelId: string; note: string; steps: string[] }[] | null;
};

/**
 * The mail a committed transition owes goes on the queue: the shop's other leads when a job card
 * awaits sign-off, the assigned technician when it is sent back. A notice that cannot be queued
 * is logged, never undoes the move (the board and the sign-off queue show it anyway).
 */
export async function queueTransitionNotices(n: TransitionNotice): Promise<void> {
  if (n.action !== 'submit' && n.action !== 'send_back') return;
  try {
    await sendJob('job-notice', { ...n, action: n.action });
  } catch (error) {
    console.error('[mail] a transition notice could not be queued', error);
  }
}

/**
 * The worker's side: reads the job as it is now and sends the notices. Throws when the mail
 * server refuses, so the queue retries (a retried submit notice may reach a lead twice).
 */
export async function deliverTransitionNotices(
  n: TransitionNotice,
  send: (mail: OutgoingMail) => Promise<void> = sendMail,
): Promise<void> {
  if (n.action !== 'submit' && n.action !== 'send_back') return;
  const db = getDb();
  const [job] = await db
    .select({
      number: jobs.number,
      assigneeId: jobs.assigneeId,
      customer: customers.name,
      year: vehicles.year,
      make: vehicles.make,
      model: vehicles.model,
      description: vehicles.description,
    })
    .from(jobs)
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(vehicles, eq(vehicles.id, jobs.vehicleId))
    .where(and(eq(jobs.shopId, n.shopId), eq(jobs.id, n.jobId)));
  const [by] = await db
    .select({ name: users.name })
    .from(users)
    .where(and(eq(users.shopId, n.shopId), eq(users.id, n.byId)));
  if (!job || !by) return;
  const facts = {
    number: job.number,
    customer: job.customer,
    vehicle:
      [job.year, job.make, job.model].filter(Boolean).join(' ') || job.description || 'vehicle',
  };
  const active = and(eq(users.shopId, n.shopId), isNull(users.removedAt));
  if (n.action === 'submit') {
    const leads = await db
      .select({ email: users.email })
      .from(users)
      .where(and(active, eq(users.role, 'lead'), ne(users.id, n.byId)));
    const mail = awaitingSignoffMail({
      ...facts,
      by: by.name,
      link: new URL(`/jobs/${n.jobId}/review`, env().APP_URL).toString(),
    });
    await Promise.all(leads.map((l) => send({ to: l.email, shopId: n.shopId, ...mail })));
    return;
  }
  if (!job.assigneeId || job.assigneeId === n.byId) return;
  const [tech] = await db
    .select({ email: users.email })
    .from(users)
    .where(and(active, eq(users.id, job.assigneeId)));
  if (!tech) return;
  const named = n.wheels ?? [];
  const positions = named.length
    ? await db
        .select({ id: jobWheels.id, position: jobWheels.position })
        .from(jobWheels)
        .where(
          and(
            eq(jobWheels.shopId, n.shopId),
            inArray(
              jobWheels.id,
              named.map((w) => w.wheelId),
            ),
          ),
        )
    : [];
  const wheels = named.map((w) => ({
    position: positions.find((p) => p.id === w.wheelId)?.position ?? 'Wheel',
    note: w.note,
    steps: w.steps,
  }));
  await send({
    to: tech.email,
    shopId: n.shopId,
    ...sentBackMail({
      ...facts,
      by: by.name,
      link: new URL(`/jobs/${n.jobId}`, env().APP_URL).toString(),
      wheels,
    }),
  });
}
