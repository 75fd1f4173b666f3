import { describe, expect, it } from 'vitest';
import { createJobCard } from '@/features/jobs/actions/job-actions';
import { createWheelSpec } from '@/features/specs/actions/save-spec';
import { boardQuerySchema } from '@/features/jobs/schemas';
import { listBoard } from '@/features/jobs/server/board';
import { listCustomers } from '@/features/jobs/server/customers';
import { getJob } from '@/features/jobs/server/jobs';
import { transitionJob } from '@/features/jobs/server/transitions';
import { createTestShop } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords, fourWheels, specBody } from '@/tests/helpers/records';

const newCustomerJob = (specId: string, extra: Record<string, unknown> = {}) => ({
  customer: { name: 'Nell Orchard', phone: '555-0100', email: '' },
  vehicle: { year: 2021, make: 'Boreal', model: 'Scout 570', description: '', vinOverride: false },
  wheels: fourWheels(specId),
  dismount: true,
  reinstall: true,
  notes: '',
  ...extra,
});

describe('specs', () => {
  it('a spec the engine refuses is not saved, with the message at the field', async () => {
    const shop = await createTestShop();
    await actAs(shop.lead.userId);
    expect(
      await createWheelSpec(null, { ...specBody, patternKind: 'skip', skipStep: 24 }),
    ).toMatchObject({
      ok: false,
      fieldErrors: { skipStep: [expect.stringMatching(/skip step must be from 1 to 23/)] },
    });
    expect(await createWheelSpec(null, { ...specBody, passPercents: [30, 70] })).toMatchObject({
      ok: false,
      fieldErrors: { passPercents: ['The last pass must be 100 (the final torque).'] },
    });
    await actAs(shop.technician.userId);
    expect(await createWheelSpec(null, specBody)).toEqual({
      ok: false,
      code: 'forbidden',
      message: 'Your role does not allow this.',
    });
  });
});

describe('job cards', () => {
  it('a technician creates a job with a new customer and vehicle inline; numbers count up per shop', async () => {
    const shop = await createTestShop();
    const records = await createRecords(shop.lead, shop.technician.userId);
    await actAs(shop.technician.userId);
    await expect(
      createJobCard(null, newCustomerJob(records.spec.id, { assigneeId: shop.technician.userId })),
    ).rejects.toMatchObject({ digest: expect.stringContaining('/jobs/') });
    const board = await listBoard(shop.technician, boardQuerySchema.parse({ sort: 'number' }));
    expect(board.data.map((r) => [r.number, r.customer, r.vehicle, r.wheelCount])).toEqual([
      [1001, 'Wren Halloway', '2022 Talonworks Ridgeback', 4],
      [1002, 'Nell Orchard', '2021 Boreal Scout 570', 4],
    ]);
  });

  it('a technician cannot assign someone else', async () => {
    const shop = await createTestShop();
    const records = await createRecords(shop.lead, shop.technician.userId);
    await actAs(shop.technician.userId);
    expect(
      await createJobCard(null, newCustomerJob(records.spec.id, { assigneeId: shop.lead.userId })),
    ).toMatchObject({
      ok: false,
      fieldErrors: { assigneeId: [expect.stringMatching(/Only a lead assigns/)] },
    });
  });

  it("another shop's spec, customer or vehicle cannot be used", async () => {
    const shop = await createTestShop();
    const other = await createTestShop('Other');
    const theirs = await createRecords(other.lead, other.technician.userId);
    await actAs(shop.lead.userId);
    expect(await createJobCard(null, newCustomerJob(theirs.spec.id))).toMatchObject({
      ok: false,
      fieldErrors: { 'wheels.0.specId': ['Pick a wheel spec of this shop.'] },
    });
    const mine = await createRecords(shop.lead, shop.technician.userId);
    expect(
      await createJobCard(null, {
        ...newCustomerJob(mine.spec.id),
        customer: undefined,
        customerId: theirs.customer.id,
      }),
    ).toMatchObject({ ok: false, message: 'That customer was not found.' });
  });

  it('mismatched tires on an axle stop the save until accepted', async () => {
    const shop = await createTestShop();
    const { spec } = await createRecords(shop.lead, shop.technician.userId);
    await actAs(shop.lead.userId);
    const wheels = fourWheels(spec.id);
    wheels[1] = { ...wheels[1]!, tireSize: '32x10R14' };
    const refused = await createJobCard(null, newCustomerJob(spec.id, { wheels }));
    expect(refused).toMatchObject({
      ok: false,
      fieldErrors: {
        wheels: expect.arrayContaining([
          expect.stringMatching(/^Front axle: 30x10R14 and 32x10R14 differ/),
        ]),
      },
    });
    await expect(
      createJobCard(null, newCustomerJob(spec.id, { wheels, acceptAxleMismatch: true })),
    ).rejects.toMatchObject({ digest: expect.stringContaining('/jobs/') });
  });

  it('an unreadable tire size is an error at its wheel', async () => {
    const shop = await createTestShop();
    const { spec } = await createRecords(shop.lead, shop.technician.userId);
    await actAs(shop.lead.userId);
    const wheels = fourWheels(spec.id);
    wheels[2] = { ...wheels[2]!, tireSize: 'big ones' };
    expect(await createJobCard(null, newCustomerJob(spec.id, { wheels }))).toMatchObject({
      ok: false,
      fieldErrors: { 'wheels.2.tireSize': [expect.stringMatching(/Unknown tire size "big ones"/)] },
    });
  });

  it('a VIN with a wrong check digit is refused; a lead may accept it; a technician may not', async () => {
    const shop = await createTestShop();
    const { spec } = await createRecords(shop.lead, shop.technician.userId);
    const badVin = {
      year: 2021,
      make: 'Boreal',
      model: 'Scout',
      description: '',
      vin: '1M8GDM9A1KP042788',
      vinOverride: false,
    };
    await actAs(shop.technician.userId);
    expect(await createJobCard(null, newCustomerJob(spec.id, { vehicle: badVin }))).toMatchObject({
      ok: false,
      fieldErrors: { vin: [expect.stringMatching(/should be X/)] },
    });
    expect(
      await createJobCard(
        null,
        newCustomerJob(spec.id, { vehicle: { ...badVin, vinOverride: true } }),
      ),
    ).toMatchObject({
      ok: false,
      fieldErrors: { vinOverride: [expect.stringMatching(/Only a lead/)] },
    });
    await actAs(shop.lead.userId);
    await expect(
      createJobCard(null, newCustomerJob(spec.id, { vehicle: { ...badVin, vinOverride: true } })),
    ).rejects.toMatchObject({ digest: expect.stringContaining('/jobs/') });
  });
});

describe('the board', () => {
  it('filters by state, assignee, search; sorts; paginates — in one shop only', async () => {
    const shop = await createTestShop();
    const other = await createTestShop('Other');
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    await createRecords(other.lead, other.technician.userId);
    await transitionJob(shop.technician, job.id, 'start', '');
    const q = (o: Record<string, string>) => listBoard(shop.lead, boardQuerySchema.parse(o));
    expect((await q({ state: 'in_progress' })).total).toBe(1);
    expect((await q({ state: 'open' })).total).toBe(0);
    expect(
      (await listBoard(shop.technician, boardQuerySchema.parse({ assignee: 'me' }))).total,
    ).toBe(1);
    expect((await listBoard(shop.lead, boardQuerySchema.parse({ assignee: 'me' }))).total).toBe(0);
    expect((await q({ q: 'halloway' })).total).toBe(1);
    expect((await q({ q: 'ridgeback' })).total).toBe(1);
    expect((await q({ q: '1001' })).total).toBe(1);
    expect((await q({ q: 'nobody%' })).total).toBe(0);
    // A % typed into the customer search is a character, not "anything".
    expect((await listCustomers(shop.shopId, { page: 1, pageSize: 10, q: '%' })).total).toBe(0);
    expect((await listCustomers(shop.shopId, { page: 1, pageSize: 10, q: 'hallo' })).total).toBe(1);
    const all = await q({ pageSize: '1', page: '1' });
    expect(all).toMatchObject({ total: 1, pageSize: 1 });
    expect((await getJob(shop.shopId, job.id)).events.map((e) => e.action)).toEqual([
      'create',
      'start',
    ]);
  });

  it('the pager counts every matching card of the shop, beyond the page shown and through a search', async () => {
    const shop = await createTestShop();
    const other = await createTestShop('Other');
    const records = await createRecords(shop.lead, shop.technician.userId);
    const otherRecords = await createRecords(other.lead, other.technician.userId);
    const create = async (userId: string, specId: string) => {
      await actAs(userId);
      await expect(createJobCard(null, newCustomerJob(specId))).rejects.toMatchObject({
        digest: expect.stringContaining('/jobs/'),
      });
    };
    await create(shop.lead.userId, records.spec.id);
    await create(shop.lead.userId, records.spec.id);
    await create(other.lead.userId, otherRecords.spec.id);
    const q = (o: Record<string, string>) =>
      listBoard(shop.lead, boardQuerySchema.parse({ sort: 'number', pageSize: '1', ...o }));
    const second = await q({ page: '2' });
    expect(second.data.map((r) => r.number)).toEqual([1002]);
    expect(second.total).toBe(3);
    // The other shop's Nell Orchard is neither shown nor counted.
    const orchard = await q({ q: 'orchard' });
    expect(orchard.data.map((r) => [r.number, r.customer])).toEqual([[1002, 'Nell Orchard']]);
    expect(orchard.total).toBe(2);
  });
});
