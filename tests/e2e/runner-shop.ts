import { expect, type Page } from '@playwright/test';
import { signUp, uniqueEmail } from './helpers';

/** A same-origin API call with the page's session, as the app itself would make it. */
export async function api<T>(
  page: Page,
  method: 'GET' | 'POST',
  path: string,
  body?: unknown,
): Promise<T> {
  const origin = new URL(page.url()).origin;
  const res = await page.request.fetch(path, {
    method,
    data: body,
    headers: { origin, 'content-type': 'application/json' },
  });
  expect(res.ok(), `${method} ${path}: ${await res.text()}`).toBe(true);
  return ((await res.json()) as { data: T }).data;
}

export const BLUE = {
  label: 'Blue click 20–200 in-lb',
  kind: 'click',
  min: 20,
  max: 200,
  unit: 'lbf-in',
  graduation: 1,
};

/**
 * Stocks the signed-in lead's shop: wrenches (verified today unless `unverified`), an 8-bolt spec
 * and a one-wheel job for `assigneeId`. A verification counts only near the setting it is used at
 * (the shop's default: ±25 %), so each wrench is checked at each working point: 43, 101 and 144 in-lb.
 */
export async function stockShop(
  page: Page,
  {
    assigneeId,
    wrenches = [BLUE],
    unverified = false,
    directional = true,
    customerEmail = '',
  }: {
    assigneeId: string;
    wrenches?: (typeof BLUE)[];
    unverified?: boolean;
    directional?: boolean;
    /** The customer's address: the signed-off report goes there. */
    customerEmail?: string;
  },
) {
  const calibrationDueOn = new Date(Date.now() + 200 * 86_400_000).toISOString().slice(0, 10);
  const wrenchIds: string[] = [];
  for (const body of wrenches) {
    const wrench = await api<{ id: string }>(page, 'POST', '/api/wrenches', {
      ...body,
      calibrationDueOn,
    });
    wrenchIds.push(wrench.id);
    if (unverified) continue;
    for (const referenceValue of [43, 101, 144]) {
      await api(page, 'POST', `/api/wrenches/${wrench.id}/verifications`, {
        referenceValue,
        readingValue: referenceValue,
        unit: 'lbf-in',
      });
    }
  }
  const spec = await api<{ id: string }>(page, 'POST', '/api/specs', {
    name: '8-bolt test ring',
    boltCount: 8,
    boltThread: 'M8×1.25',
    finalTorque: 12,
    torqueUnit: 'lbf-ft',
    passPercents: [30, 70, 100],
    patternKind: 'cross',
    checkPass: true,
    maxBeadSeatPressure: 30,
    runningPressure: 14,
    pressureUnit: 'psi',
  });
  const job = await api<{
    id: string;
    number: number;
    wheels: { id: string }[];
    customer: { id: string };
  }>(page, 'POST', '/api/jobs', {
    customer: { name: 'Ada Offroad', phone: '', email: customerEmail },
    vehicle: { make: 'Boreal', model: 'Scout', description: '' },
    wheels: [
      {
        position: 'LF',
        specId: spec.id,
        tireSize: '26x9-14',
        directional,
        targetPressure: 8,
        pressureUnit: 'psi',
      },
    ],
    dismount: false,
    reinstall: false,
    assigneeId,
  });
  return { wrenchIds, specId: spec.id, job, wheelId: job.wheels[0]!.id };
}

/** A new shop whose lead has one wheel of their own to run (see `stockShop`). */
export async function setUpWheel(
  page: Page,
  options: { wrenches?: (typeof BLUE)[]; unverified?: boolean } = {},
) {
  const email = uniqueEmail('runner');
  await signUp(page, 'Offline Rim Shop', 'Lou Bead', email);
  const me = (await api<{ id: string }[]>(page, 'GET', '/api/team/members'))[0]!;
  const { job, wheelId } = await stockShop(page, { ...options, assigneeId: me.id });
  return { job, wheelId, email };
}
