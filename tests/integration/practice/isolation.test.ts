import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { postToWheelEvents } from '@/tests/helpers/wheel-events-route';
import * as job from '@/app/api/jobs/[jobId]/route';
import * as jobReport from '@/app/api/jobs/[jobId]/report/route';
import * as jobReview from '@/app/api/jobs/[jobId]/review/route';
import * as jobTransitions from '@/app/api/jobs/[jobId]/transitions/route';
import * as jobWheels from '@/app/api/jobs/[jobId]/wheels/route';
import * as board from '@/app/api/jobs/route';
import * as photo from '@/app/api/photos/[photoId]/route';
import * as practiceFinish from '@/app/api/practice/attempts/[attemptId]/finish/route';
import * as practiceEvents from '@/app/api/practice/attempts/[attemptId]/events/route';
import * as practiceStart from '@/app/api/practice/attempts/route';
import * as signoffQueue from '@/app/api/signoff-queue/route';
import * as wheel from '@/app/api/wheels/[wheelId]/route';
import * as wheelEvents from '@/app/api/wheels/[wheelId]/events/route';
import * as wheelSubmit from '@/app/api/wheels/[wheelId]/submit/route';
import * as verifications from '@/app/api/wrenches/[wrenchId]/verifications/route';
import * as crib from '@/app/api/wrenches/route';
import type { PracticeSetup } from '@/features/practice/types';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords } from '@/tests/helpers/records';
import { awaitingSignoff } from '@/tests/helpers/review-work';

type Handler = (
  req: Request,
  ctx: { params: Promise<Record<string, string>> },
) => Promise<Response>;
type Shop = Awaited<ReturnType<typeof createTestShop>>;
let a: Shop, records: Awaited<ReturnType<typeof createRecords>>;
const cookies: Record<'lead' | 'apprentice', string> = { lead: '', apprentice: '' };

async function call(
  handler: unknown,
  path: string,
  p: Record<string, string>,
  init: { method?: string; body?: unknown; who?: 'lead' | 'apprentice' } = {},
) {
  const res = await (handler as Handler)(
    apiRequest(path, { method: init.method, body: init.body, cookie: cookies[init.who ?? 'lead'] }),
    params(p),
  );
  return { status: res.status, text: await res.text() };
}

let t = 0;
const base = Date.now() - 60 * 60 * 1000;
const event = (type: string, payload: unknown) => ({
  type,
  payload,
  clientId: randomUUID(),
  clientAt: new Date(base + 1000 * t++).toISOString(),
});

/** A finished wrench-setup attempt by the apprentice on the shop's spec, bolts on a named wrench. */
async function practiseOnce() {
  const started = await call(
    practiceStart.POST,
    '/api/practice/attempts',
    {},
    {
      method: 'POST',
      who: 'apprentice',
      body: { source: 'spec', specId: records.spec.id, level: 'wrench_setup' },
    },
  );
  const { id, setup } = (JSON.parse(started.text) as { data: { id: string; setup: PracticeSetup } })
    .data;
  const wrench = setup.wrenches[0]!;
  const events = [
    event('wrench_chosen', { pass: 1, wrenchId: wrench.id }),
    ...setup.snapshot.plan.passes[0]!.order.map((bolt) =>
      event('bolt_confirmed', {
        pass: 1,
        bolt,
        wrenchId: wrench.id,
        setting: { value: wrench.min, unit: wrench.unit },
      }),
    ),
  ];
  const path = `/api/practice/attempts/${id}`;
  expect(
    (
      await call(
        practiceEvents.POST,
        `${path}/events`,
        { attemptId: id },
        { method: 'POST', who: 'apprentice', body: { events } },
      )
    ).status,
  ).toBe(200);
  expect(
    (
      await call(
        practiceFinish.POST,
        `${path}/finish`,
        { attemptId: id },
        { method: 'POST', who: 'apprentice' },
      )
    ).status,
  ).toBe(200);
  return { id, events, wrenchIds: setup.wrenches.map((w) => w.id) };
}

/** What the board, the sign-off queue and the tool crib answer, as the lead reads them. */
async function shopViews() {
  const wrenchIds = [records.wrench.id];
  return {
    board: (await call(board.GET, '/api/jobs', {})).text,
    signoff: (await call(signoffQueue.GET, '/api/signoff-queue', {})).text,
    crib: (await call(crib.GET, '/api/wrenches', {})).text,
    verifications: await Promise.all(
      wrenchIds.map(
        async (wrenchId) =>
          (await call(verifications.GET, `/api/wrenches/${wrenchId}/verifications`, { wrenchId }))
            .text,
      ),
    ),
  };
}

beforeAll(async () => {
  a = await createTestShop('Isolation A');
  records = await createRecords(a.lead, a.technician.userId);
  // A job waiting for sign-off, so the queue the attempt must not join is not empty.
  await awaitingSignoff(a.shopId, records.job.id, a.technician.userId, { at: new Date() });
  cookies.lead = await cookieFor(a.lead.userId);
  cookies.apprentice = await cookieFor(a.apprentice.userId);
});

describe('no practice row is reachable through a job, board, sign-off, report or tool-crib route', () => {
  it('board, sign-off queue and tool crib read the same after a whole attempt, and never name it', async () => {
    const before = await shopViews();
    // The views are really read: the job is on the board and in the queue, the wrench in the crib.
    expect(before.board).toContain(records.job.id);
    expect(before.signoff).toContain(records.job.id);
    expect(before.crib).toContain(records.wrench.id);
    const attempt = await practiseOnce();
    const after = await shopViews();
    expect(after).toEqual(before);
    expect(JSON.stringify(after)).not.toContain(attempt.id);
  });

  it("an attempt's id is not found as a job, a wheel, a report, a review or a photo, even for the lead", async () => {
    const { id, events } = await practiseOnce();
    const asJob = { jobId: id };
    const asWheel = { wheelId: id };
    const tries = [
      call(job.GET, `/api/jobs/${id}`, asJob),
      call(job.PATCH, `/api/jobs/${id}`, asJob, { method: 'PATCH', body: { notes: 'x' } }),
      call(jobWheels.GET, `/api/jobs/${id}/wheels`, asJob),
      call(jobReport.GET, `/api/jobs/${id}/report`, asJob),
      call(jobReview.GET, `/api/jobs/${id}/review`, asJob),
      call(jobTransitions.POST, `/api/jobs/${id}/transitions`, asJob, {
        method: 'POST',
        body: { action: 'start' },
      }),
      call(wheel.GET, `/api/wheels/${id}`, asWheel),
      call(wheelEvents.GET, `/api/wheels/${id}/events`, asWheel),
      call(wheelSubmit.POST, `/api/wheels/${id}/submit`, asWheel, { method: 'POST' }),
      call(photo.GET, `/api/photos/${id}`, { photoId: id }),
    ];
    for (const res of await Promise.all(tries)) {
      expect(res.status, res.text).toBe(404);
      expect(res.text).not.toContain(events[0]!.clientId);
    }
    // The runner's own save path does not take an attempt for a wheel either.
    await actAs(a.lead.userId);
    expect(
      await postToWheelEvents(null, { wheelId: id, events: [event('hand_started', { bolt: 1 })] }),
    ).toMatchObject({ ok: false, code: 'not_found' });
  });
});
