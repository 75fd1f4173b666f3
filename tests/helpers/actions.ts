import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { getDb } from '@/db';
import {
  customerReportEmails,
  customers,
  jobs,
  practiceClearances,
  recheckReminders,
  users,
} from '@/db/schema';
import { createInvite } from '@/features/accounts/server/invites';
import { createJob, getJob } from '@/features/jobs/server/jobs';
import { createReportLink } from '@/features/reports/server/report-links';
import type { Permission } from '@/server/auth/permissions';
import type { Member } from '@/server/auth/session';
import { createTestShop, PASSWORD } from './factories';
import { createRecords, fourWheels, specBody, wrenchBody } from './records';
import { awaitingSignoff } from './review-work';

/**
 * Every server action of the app, found by reading the source tree (Vite's glob), not by a list
 * kept by hand: an action added without an entry in ACTION_CASES fails the access test.
 */
const modules = import.meta.glob<Record<string, unknown>>([
  '/features/*/actions/*.ts',
  '/app/**/actions.ts',
]);

export type AnyAction = (prev: unknown, input: unknown) => Promise<unknown>;

export async function loadActions(): Promise<Map<string, AnyAction>> {
  const found = new Map<string, AnyAction>();
  for (const [file, load] of Object.entries(modules)) {
    for (const [name, value] of Object.entries(await load())) {
      if (typeof value === 'function') found.set(`${file}#${name}`, value as AnyAction);
    }
  }
  return found;
}

export type Shop = Awaited<ReturnType<typeof createTestShop>>;
export type World = { a: Shop; b: Shop; records: Awaited<ReturnType<typeof createRecords>> };

export async function createWorld(): Promise<World> {
  const a = await createTestShop('Shop A');
  const b = await createTestShop('Shop B');
  return { a, b, records: await createRecords(a.lead, a.technician.userId) };
}

async function freshTechnician(shop: Shop) {
  const [row] = await getDb()
    .insert(users)
    .values({
      shopId: shop.shopId,
      role: 'technician',
      name: 'Fern Fresh',
      email: `fresh-${randomUUID()}@shop.test`,
      passwordHash: 'x',
    })
    .returning({ id: users.id });
  return row!.id;
}

async function freshJob(w: World) {
  const { id } = await createJob(w.a.lead, {
    customerId: w.records.customer.id,
    vehicleId: w.records.vehicle.id,
    wheels: fourWheels(w.records.spec.id),
    dismount: true,
    reinstall: true,
    assigneeId: w.a.technician.userId,
    notes: '',
    acceptAxleMismatch: false,
  });
  return getJob(w.a.shopId, id);
}

/** A new apprentice of the shop, optionally already cleared for real wheels by its lead. */
async function freshApprentice(shop: Shop, cleared = false) {
  const [row] = await getDb()
    .insert(users)
    .values({
      shopId: shop.shopId,
      role: 'apprentice',
      name: 'Ash Apprentice',
      email: `apprentice-${randomUUID()}@shop.test`,
      passwordHash: 'x',
    })
    .returning({ id: users.id });
  if (cleared)
    await getDb()
      .insert(practiceClearances)
      .values({ shopId: shop.shopId, userId: row!.id, clearedById: shop.lead.userId });
  return row!.id;
}

/** A fresh signed-off job of shop A with its follow-up rows: the reminder scheduled, the e-mail failed. */
async function signedOffJob(w: World) {
  const job = await freshJob(w);
  await getDb().update(jobs).set({ state: 'signed_off' }).where(eq(jobs.id, job.id));
  // Another case edits this customer (without an address): give it one again.
  await getDb()
    .update(customers)
    .set({ email: 'wren@example.test' })
    .where(eq(customers.id, w.records.customer.id));
  await getDb()
    .insert(recheckReminders)
    .values({ shopId: w.a.shopId, jobId: job.id, dueOn: '2099-06-01' });
  await getDb().insert(customerReportEmails).values({
    shopId: w.a.shopId,
    jobId: job.id,
    toAddress: 'wren@example.test',
    status: 'failed',
    lastError: 'relay refused',
  });
  return job;
}

/** A fresh job of shop A, run and submitted by its technician, waiting for a lead. */
async function awaitingJob(w: World) {
  const job = await freshJob(w);
  await awaitingSignoff(w.a.shopId, job.id, w.a.technician.userId, { at: new Date() });
  return job;
}

/**
 * How each action is called well against shop A's rows, and what its access rule is.
 * `permission`: the role-table permission its wrapper checks ('public' for the signed-out
 * actions, 'session' for sign-out, which anyone may call). `asAllowed`: what a permitted member
 * of shop A gets where a row rule says more than the role table (default: it works).
 * `otherShop`: what shop B's lead gets with shop A's ids — `not_found`, or `ok` when the action
 * takes no id and simply works inside the caller's own shop.
 */
export type ActionCase = {
  permission: Permission | 'public' | 'session';
  input: (w: World, caller: Member | null) => Promise<unknown> | unknown;
  asAllowed?: Partial<Record<'lead' | 'technician' | 'apprentice', string>>;
  otherShop: 'not_found' | 'ok' | 'invalid' | 'public';
  /** For the public actions: what anyone gets with this input (default: it works). */
  publicGets?: string;
};

export const ACTION_CASES: Record<string, ActionCase> = {
  // An unknown token: the answer is the same for anyone, signed in or not.
  '/features/accounts/actions/accept-invite.ts#acceptTeamInvite': {
    permission: 'public',
    input: () => ({ token: 'x'.repeat(40), name: 'Nia New', password: 'a long enough password' }),
    otherShop: 'public',
    publicGets: 'invalid',
  },
  '/features/accounts/actions/sign-in.ts#signIn': {
    permission: 'public',
    input: (w) => ({ email: w.a.technician.email, password: PASSWORD }),
    otherShop: 'public',
  },
  '/features/accounts/actions/sign-up.ts#signUp': {
    permission: 'public',
    input: () => ({
      shopName: 'New Shop',
      name: 'Nia New',
      email: `new-${randomUUID()}@shop.test`,
      password: 'a long enough password',
    }),
    otherShop: 'public',
  },
  // An unknown link: the answer is the same for anyone, signed in or not.
  '/features/accounts/actions/sign-up.ts#finishSignUp': {
    permission: 'public',
    input: () => ({ token: 'x'.repeat(40) }),
    otherShop: 'public',
    publicGets: 'invalid',
  },
  '/features/accounts/actions/sign-out.ts#signOut': {
    permission: 'session',
    input: () => undefined,
    otherShop: 'public',
  },
  '/features/accounts/actions/change-role.ts#changeMemberRole': {
    permission: 'team.manage',
    input: async (w) => ({ memberId: await freshTechnician(w.a), role: 'apprentice' }),
    otherShop: 'not_found',
  },
  '/features/accounts/actions/invite-member.ts#inviteMember': {
    permission: 'team.manage',
    input: () => ({ email: `invitee-${randomUUID()}@shop.test`, role: 'technician' }),
    otherShop: 'ok',
  },
  '/features/accounts/actions/remove-member.ts#removeTeamMember': {
    permission: 'team.manage',
    input: async (w) => ({ memberId: await freshTechnician(w.a) }),
    otherShop: 'not_found',
  },
  '/features/accounts/actions/revoke-invite.ts#revokeTeamInvite': {
    permission: 'team.manage',
    input: async (w) => ({
      inviteId: (
        await createInvite(w.a.lead, {
          email: `invitee-${randomUUID()}@shop.test`,
          role: 'technician',
        })
      ).id,
    }),
    otherShop: 'not_found',
  },
  '/features/jobs/actions/customer-actions.ts#addCustomer': {
    permission: 'jobs.create',
    input: () => ({ name: 'Nell Orchard', phone: '555-0100' }),
    otherShop: 'ok',
  },
  '/features/jobs/actions/customer-actions.ts#editCustomer': {
    permission: 'jobs.edit',
    input: (w) => ({ customerId: w.records.customer.id, name: 'Wren Halloway', phone: '555-0142' }),
    otherShop: 'not_found',
  },
  '/features/jobs/actions/customer-actions.ts#addVehicle': {
    permission: 'jobs.create',
    input: (w) => ({ customerId: w.records.customer.id, make: 'Boreal', model: 'Scout' }),
    otherShop: 'not_found',
  },
  // Another shop's spec ids are refused as a field ("pick a spec of this shop"), nothing is created.
  '/features/jobs/actions/job-actions.ts#createJobCard': {
    permission: 'jobs.create',
    input: (w) => ({
      customerId: w.records.customer.id,
      vehicleId: w.records.vehicle.id,
      wheels: JSON.stringify(fourWheels(w.records.spec.id)),
    }),
    otherShop: 'invalid',
  },
  '/features/jobs/actions/job-actions.ts#updateJobCard': {
    permission: 'jobs.edit',
    input: (w) => ({ jobId: w.records.job.id, notes: 'Bring the cage.' }),
    otherShop: 'not_found',
  },
  // The role table lets every member see the board; who may move which card is a row rule.
  '/features/jobs/actions/job-actions.ts#moveJobCard': {
    permission: 'board.view',
    input: async (w) => ({ jobId: (await freshJob(w)).id, action: 'start' }),
    asAllowed: { apprentice: 'forbidden' },
    otherShop: 'not_found',
  },
  '/features/practice/actions/clearance-actions.ts#clearForRealWheels': {
    permission: 'practice.clear',
    input: async (w) => ({
      userId: await freshApprentice(w.a),
      note: 'Clean passes at every level.',
    }),
    otherShop: 'not_found',
  },
  '/features/practice/actions/clearance-actions.ts#revokeRealWheelsClearance': {
    permission: 'practice.clear',
    input: async (w) => ({ userId: await freshApprentice(w.a, true) }),
    otherShop: 'not_found',
  },
  '/features/practice/actions/practice-actions.ts#startPracticeAttempt': {
    permission: 'practice.run',
    input: () => ({ source: 'surprise', level: 'guided' }),
    otherShop: 'ok',
  },
  '/features/follow-up/actions/follow-up-actions.ts#cancelRecheckReminder': {
    permission: 'followup.manage',
    input: async (w) => ({ jobId: (await signedOffJob(w)).id }),
    otherShop: 'not_found',
  },
  '/features/follow-up/actions/follow-up-actions.ts#rescheduleRecheckReminder': {
    permission: 'followup.manage',
    input: async (w) => ({ jobId: (await signedOffJob(w)).id, dueOn: '2099-07-01' }),
    otherShop: 'not_found',
  },
  '/features/follow-up/actions/follow-up-actions.ts#sendCustomerEmailAgain': {
    permission: 'followup.manage',
    input: async (w) => ({ jobId: (await signedOffJob(w)).id }),
    otherShop: 'not_found',
  },
  '/features/specs/actions/save-spec.ts#createWheelSpec': {
    permission: 'specs.manage',
    input: () => ({ ...specBody, name: `Spec ${randomUUID().slice(0, 6)}` }),
    otherShop: 'ok',
  },
  '/features/specs/actions/save-spec.ts#updateWheelSpec': {
    permission: 'specs.manage',
    input: (w) => ({ ...specBody, specId: w.records.spec.id }),
    otherShop: 'not_found',
  },
  '/features/settings/actions/save-settings.ts#saveSettings': {
    permission: 'shop.settings',
    input: () => ({ recheckDays: '7' }),
    otherShop: 'ok',
  },
  '/features/tool-crib/actions/wrench-actions.ts#addWrench': {
    permission: 'wrenches.manage',
    input: () => ({ ...wrenchBody, label: 'Another click wrench' }),
    otherShop: 'ok',
  },
  '/features/tool-crib/actions/wrench-actions.ts#editWrench': {
    permission: 'wrenches.manage',
    input: (w) => ({ ...wrenchBody, wrenchId: w.records.wrench.id }),
    otherShop: 'not_found',
  },
  '/features/tool-crib/actions/wrench-actions.ts#verifyWrench': {
    permission: 'verifications.record',
    input: (w) => ({
      wrenchId: w.records.wrench.id,
      referenceValue: 100,
      readingValue: 101,
      unit: 'lbf-in',
    }),
    otherShop: 'not_found',
  },
  // The wrench is in service, so a permitted lead is told so (conflict); the rule still holds.
  '/features/tool-crib/actions/wrench-actions.ts#putBackInService': {
    permission: 'wrenches.clear',
    input: (w) => ({ wrenchId: w.records.wrench.id, reason: 'recalibrated at the lab' }),
    asAllowed: { lead: 'conflict' },
    otherShop: 'not_found',
  },
  '/app/(shop)/jobs/[jobId]/review/actions.ts#approveReviewed': {
    permission: 'jobs.signoff',
    input: async (w) => ({ jobId: (await awaitingJob(w)).id }),
    otherShop: 'not_found',
  },
  '/app/(shop)/jobs/[jobId]/review/actions.ts#sendBackReviewed': {
    permission: 'jobs.signoff',
    input: async (w) => {
      const job = await awaitingJob(w);
      return {
        jobId: job.id,
        wheels: [{ wheelId: job.wheels[0]!.id, note: 'Redo the passes at a steady pace.' }],
      };
    },
    otherShop: 'not_found',
  },
  '/features/reports/actions/report-link-actions.ts#createCustomerLink': {
    permission: 'reports.links',
    input: async (w) => ({ jobId: (await signedOffJob(w)).id }),
    otherShop: 'not_found',
  },
  '/features/reports/actions/report-link-actions.ts#revokeCustomerLink': {
    permission: 'reports.links',
    input: async (w) => {
      const job = await signedOffJob(w);
      return { linkId: (await createReportLink(w.a.shopId, job.id, w.a.lead.userId)).id };
    },
    otherShop: 'not_found',
  },
};

/** Calls an action and names the outcome: 'ok' (a result or a redirect), or the failure code. */
export async function outcome(
  action: AnyAction,
  input: unknown,
): Promise<{ code: string; result?: unknown }> {
  try {
    const result = (await action(null, input)) as { ok?: boolean; code?: string } | undefined;
    if (result && result.ok === false) return { code: result.code ?? 'missing-code', result };
    return { code: 'ok', result };
  } catch (error) {
    const digest = (error as { digest?: unknown })?.digest;
    if (typeof digest === 'string' && digest.startsWith('NEXT_REDIRECT')) return { code: 'ok' };
    if (typeof digest === 'string' && digest.startsWith('NEXT_HTTP_ERROR_FALLBACK;404'))
      return { code: 'not_found' };
    throw error;
  }
}
