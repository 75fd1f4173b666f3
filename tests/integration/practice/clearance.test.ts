import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { postToWheelEvents } from '@/tests/helpers/wheel-events-route';
import { POST as createJobApi } from '@/app/api/jobs/route';
import { PATCH as patchJob } from '@/app/api/jobs/[jobId]/route';
import { GET as wheelEvents } from '@/app/api/wheels/[wheelId]/events/route';
import {
  clearForRealWheels,
  revokeRealWheelsClearance,
} from '@/features/practice/actions/clearance-actions';
import { createJobCard } from '@/features/jobs/actions/job-actions';
import { getJob, listAssignees } from '@/features/jobs/server/jobs';
import { listApprenticeStanding } from '@/features/practice/server/clearances';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords, fourWheels } from '@/tests/helpers/records';

type Shop = Awaited<ReturnType<typeof createTestShop>>;
let a: Shop, b: Shop, records: Awaited<ReturnType<typeof createRecords>>;
let leadCookie: string, apprenticeCookie: string;

beforeAll(async () => {
  a = await createTestShop('Clearance A');
  b = await createTestShop('Clearance B');
  records = await createRecords(a.lead, a.technician.userId);
  leadCookie = await cookieFor(a.lead.userId);
  apprenticeCookie = await cookieFor(a.apprentice.userId);
});

// The factory's apprentice is "Ada Apprentice"; the message names them and where to be cleared.
const refusal =
  'Ada Apprentice is an apprentice not yet cleared for real wheels — a lead clears them on Practice progress.';

const jobBody = (assigneeId: string | null) => ({
  customerId: records.customer.id,
  vehicleId: records.vehicle.id,
  wheels: fourWheels(records.spec.id),
  dismount: true,
  reinstall: true,
  ...(assigneeId ? { assigneeId } : {}),
  notes: '',
});
const newJob = async (assigneeId: string | null) => {
  const res = await createJobApi(
    apiRequest('/api/jobs', { method: 'POST', cookie: leadCookie, body: jobBody(assigneeId) }),
    params({}),
  );
  return {
    status: res.status,
    body: (await res.json()) as {
      data?: { id: string; wheels: { id: string }[] };
      error?: { message: string; fields?: Record<string, string[]> };
    },
  };
};
const assign = async (jobId: string, assigneeId: string) => {
  const res = await patchJob(
    apiRequest(`/api/jobs/${jobId}`, { method: 'PATCH', cookie: leadCookie, body: { assigneeId } }),
    params({ jobId }),
  );
  return { status: res.status, body: (await res.json()) as { error?: { message: string } } };
};
const runnerReads = async (wheelId: string) => {
  const res = await wheelEvents(
    apiRequest(`/api/wheels/${wheelId}/events`, { cookie: apprenticeCookie }),
    params({ wheelId }),
  );
  return { status: res.status, body: (await res.json()) as { error?: { message: string } } };
};
// The runner's own save path, as the apprentice's phone sends a confirmation.
const runAsApprentice = async (wheelId: string) => {
  await actAs(a.apprentice.userId);
  return postToWheelEvents(null, {
    wheelId,
    events: [
      {
        type: 'step_done',
        payload: { step: 'safety', checklist: [] },
        clientId: randomUUID(),
        clientAt: new Date().toISOString(),
      },
    ],
  });
};
const asLead = async <T>(call: () => Promise<T>) => {
  await actAs(a.lead.userId);
  return call();
};

describe('clearing an apprentice gates real work', () => {
  it('refused → cleared → accepted → revoked → refused for new work, on the API, the form and the runner', async () => {
    // Not cleared: the API, the job form's action and the assignee list all refuse.
    const refused = await newJob(a.apprentice.userId);
    expect(refused.status).toBe(400);
    expect(refused.body.error?.fields?.assigneeId).toEqual([refusal]);
    const form = (await asLead(() =>
      createJobCard(null, {
        customerId: records.customer.id,
        vehicleId: records.vehicle.id,
        wheels: JSON.stringify(fourWheels(records.spec.id)),
        assigneeId: a.apprentice.userId,
      }),
    )) as { ok: boolean; fieldErrors?: Record<string, string[]> };
    expect(form.ok).toBe(false);
    expect(form.fieldErrors?.assigneeId).toEqual([refusal]);
    expect((await listAssignees(a.shopId)).map((p) => p.id)).not.toContain(a.apprentice.userId);

    const unassigned = (await newJob(null)).body.data!;
    expect((await assign(unassigned.id, a.apprentice.userId)).body.error?.message).toBe(refusal);

    // Cleared by the lead: assignable, and the runner opens their assigned wheel.
    const cleared = await asLead(() =>
      clearForRealWheels(null, {
        userId: a.apprentice.userId,
        note: 'Three clean from-memory runs.',
      }),
    );
    expect(cleared).toMatchObject({ ok: true });
    expect((await listAssignees(a.shopId)).map((p) => p.id)).toContain(a.apprentice.userId);
    expect((await assign(unassigned.id, a.apprentice.userId)).status).toBe(200);
    expect((await runnerReads(unassigned.wheels[0]!.id)).status).toBe(200);
    expect(await runAsApprentice(unassigned.wheels[0]!.id)).toMatchObject({ ok: true });
    // Still only their own wheels: the technician's job stays closed to them.
    const techJob = await getJob(a.shopId, records.job.id);
    expect((await runnerReads(techJob.wheels[0]!.id)).status).toBe(403);

    // Revoked: the same session is refused by the runner at once; new assignments are refused;
    // the job card they hold stays assigned and the lead is warned about it.
    expect(
      await asLead(() => revokeRealWheelsClearance(null, { userId: a.apprentice.userId })),
    ).toMatchObject({ ok: true });
    const afterRevoke = await runnerReads(unassigned.wheels[0]!.id);
    expect(afterRevoke.status).toBe(403);
    expect(await runAsApprentice(unassigned.wheels[0]!.id)).toMatchObject({
      ok: false,
      code: 'forbidden',
    });
    expect((await newJob(a.apprentice.userId)).body.error?.fields?.assigneeId).toEqual([refusal]);
    const [standing] = await listApprenticeStanding(a.shopId, { userId: a.apprentice.userId });
    expect(standing).toMatchObject({ cleared: false, unfinishedJobs: 1 });
    expect(standing!.history[0]).toMatchObject({
      clearedBy: a.lead.name,
      revokedBy: a.lead.name,
      note: 'Three clean from-memory runs.',
    });
    expect(standing!.history[0]!.revokedAt).toBeInstanceOf(Date);
  });

  it('clearing twice, revoking what is not standing, or clearing a technician is refused with why', async () => {
    const apprentice = a.apprentice.userId;
    expect(await asLead(() => clearForRealWheels(null, { userId: apprentice }))).toMatchObject({
      ok: true,
    });
    expect(await asLead(() => clearForRealWheels(null, { userId: apprentice }))).toMatchObject({
      ok: false,
      code: 'conflict',
      message: expect.stringMatching(/already cleared/),
    });
    await asLead(() => revokeRealWheelsClearance(null, { userId: apprentice }));
    expect(
      await asLead(() => revokeRealWheelsClearance(null, { userId: apprentice })),
    ).toMatchObject({ ok: false, code: 'conflict' });
    expect(
      await asLead(() => clearForRealWheels(null, { userId: a.technician.userId })),
    ).toMatchObject({
      ok: false,
      code: 'invalid',
      message: expect.stringMatching(/not an apprentice/),
    });
  });

  it('a card held by an apprentice whose clearance was revoked can still have its notes and due date edited; only a new assignee is checked', async () => {
    const [standing] = await listApprenticeStanding(a.shopId, { userId: a.apprentice.userId });
    if (!standing!.cleared)
      await asLead(() => clearForRealWheels(null, { userId: a.apprentice.userId }));
    const held = (await newJob(a.apprentice.userId)).body.data!;
    await asLead(() => revokeRealWheelsClearance(null, { userId: a.apprentice.userId }));
    const edit = async (body: Record<string, unknown>) => {
      const res = await patchJob(
        apiRequest(`/api/jobs/${held.id}`, { method: 'PATCH', cookie: leadCookie, body }),
        params({ jobId: held.id }),
      );
      return { status: res.status, body: (await res.json()) as { error?: { message: string } } };
    };
    // The job form sends the assignee it shows along with the edit.
    const dueAt = new Date(Date.now() + 2 * 86_400_000).toISOString();
    expect(
      await edit({
        assigneeId: a.apprentice.userId,
        notes: 'Customer waits in the lounge.',
        dueAt,
      }),
    ).toMatchObject({ status: 200 });
    expect((await edit({ notes: 'Customer left a phone number.' })).status).toBe(200);
    const job = await getJob(a.shopId, held.id);
    expect(job).toMatchObject({
      assignee: { id: a.apprentice.userId },
      notes: 'Customer left a phone number.',
      dueAt,
    });
    // Handing it back to the apprentice after a reassignment is a new assignee: refused.
    expect((await assign(held.id, a.technician.userId)).status).toBe(200);
    expect((await assign(held.id, a.apprentice.userId)).body.error?.message).toBe(refusal);
  });

  it("another shop's lead cannot clear this shop's apprentice, nor see them", async () => {
    await actAs(b.lead.userId);
    expect(await clearForRealWheels(null, { userId: a.apprentice.userId })).toMatchObject({
      ok: false,
      code: 'not_found',
    });
    expect(await clearForRealWheels(null, { userId: randomUUID() })).toMatchObject({
      code: 'not_found',
    });
    expect(await listApprenticeStanding(b.shopId, { userId: a.apprentice.userId })).toEqual([]);
  });
});
