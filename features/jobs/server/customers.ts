import 'server-only';
import { and, asc, count, eq, ilike, or } from 'drizzle-orm';
import type { z } from 'zod';
import { getDb, type Database } from '@/db';
import { customers, vehicles } from '@/db/schema';
import { can } from '@/server/auth/permissions';
import type { Member } from '@/server/auth/session';
import { containsPattern } from '@/server/db-search';
import { DomainError, notFound } from '@/server/errors';
import type { customerSchema, vehicleFields } from '../schemas';
import { checkVin, normaliseVin } from '../vin';

type CustomerInput = z.infer<typeof customerSchema>;
type VehicleFields = z.infer<z.ZodObject<typeof vehicleFields>>;
type Tx = Parameters<Parameters<Database['transaction']>[0]>[0] | Database;

export type Customer = { id: string; name: string; phone: string; email: string };
export type Vehicle = {
  id: string;
  customerId: string;
  year: number | null;
  make: string;
  model: string;
  description: string;
  vin: string | null;
  vinCheckOverridden: boolean;
};

const customerColumns = {
  id: customers.id,
  name: customers.name,
  phone: customers.phone,
  email: customers.email,
};
const vehicleColumns = {
  id: vehicles.id,
  customerId: vehicles.customerId,
  year: vehicles.year,
  make: vehicles.make,
  model: vehicles.model,
  description: vehicles.description,
  vin: vehicles.vin,
  vinCheckOverridden: vehicles.vinCheckOverridden,
};

export const vehicleLabel = (v: Pick<Vehicle, 'year' | 'make' | 'model' | 'description'>) =>
  [v.year, v.make, v.model].filter(Boolean).join(' ') || v.description || 'Vehicle';

export async function listCustomers(
  shopId: string,
  opts: { page: number; pageSize: number; q?: string },
) {
  const search = opts.q ? containsPattern(opts.q) : undefined;
  const where = and(
    eq(customers.shopId, shopId),
    search
      ? or(
          ilike(customers.name, search),
          ilike(customers.phone, search),
          ilike(customers.email, search),
        )
      : undefined,
  );
  const db = getDb();
  const [rows, [total]] = await Promise.all([
    db
      .select(customerColumns)
      .from(customers)
      .where(where)
      .orderBy(asc(customers.name))
      .limit(opts.pageSize)
      .offset((opts.page - 1) * opts.pageSize),
    db.select({ n: count() }).from(customers).where(where),
  ]);
  return { data: rows, page: opts.page, pageSize: opts.pageSize, total: total?.n ?? 0 };
}

export async function getCustomer(
  shopId: string,
  customerId: string,
  db: Tx = getDb(),
): Promise<Customer> {
  const [row] = await db
    .select(customerColumns)
    .from(customers)
    .where(and(eq(customers.shopId, shopId), eq(customers.id, customerId)));
  if (!row) throw notFound('That customer');
  return row;
}

export async function createCustomer(
  actor: Member,
  input: CustomerInput,
  db: Tx = getDb(),
): Promise<Customer> {
  const [row] = await db
    .insert(customers)
    .values({ ...input, shopId: actor.shopId })
    .returning(customerColumns);
  return row!;
}

export async function updateCustomer(
  actor: Member,
  customerId: string,
  input: CustomerInput,
): Promise<Customer> {
  const [row] = await getDb()
    .update(customers)
    .set(input)
    .where(and(eq(customers.shopId, actor.shopId), eq(customers.id, customerId)))
    .returning(customerColumns);
  if (!row) throw notFound('That customer');
  return row;
}

export async function listVehicles(
  shopId: string,
  opts: { page: number; pageSize: number; customerId?: string },
) {
  const where = and(
    eq(vehicles.shopId, shopId),
    opts.customerId ? eq(vehicles.customerId, opts.customerId) : undefined,
  );
  const db = getDb();
  const [rows, [total]] = await Promise.all([
    db
      .select(vehicleColumns)
      .from(vehicles)
      .where(where)
      .orderBy(asc(vehicles.make), asc(vehicles.model))
      .limit(opts.pageSize)
      .offset((opts.page - 1) * opts.pageSize),
    db.select({ n: count() }).from(vehicles).where(where),
  ]);
  return { data: rows, page: opts.page, pageSize: opts.pageSize, total: total?.n ?? 0 };
}

export async function getVehicle(
  shopId: string,
  vehicleId: string,
  db: Tx = getDb(),
): Promise<Vehicle> {
  const [row] = await db
    .select(vehicleColumns)
    .from(vehicles)
    .where(and(eq(vehicles.shopId, shopId), eq(vehicles.id, vehicleId)));
  if (!row) throw notFound('That vehicle');
  return row;
}

/**
 * The VIN, normalised and checked (49 CFR 565). A wrong check digit is an error unless a lead
 * accepts it; a VIN of the wrong shape is always an error.
 */
function checkedVin(
  actor: Member,
  input: Pick<VehicleFields, 'vin' | 'vinOverride'>,
  field = 'vin',
) {
  if (!input.vin) return { vin: null, vinCheckOverridden: false };
  const result = checkVin(input.vin);
  if (result.valid) return { vin: normaliseVin(input.vin), vinCheckOverridden: false };
  if (result.reason === 'check-digit' && input.vinOverride) {
    if (!can(actor.role, 'jobs.edit')) {
      const message = 'Only a lead can accept a VIN whose check digit does not match.';
      throw new DomainError('forbidden', message, { vinOverride: [message] });
    }
    return { vin: normaliseVin(input.vin), vinCheckOverridden: true };
  }
  throw new DomainError('invalid', result.message, { [field]: [result.message] });
}

export async function createVehicle(
  actor: Member,
  customerId: string,
  input: VehicleFields,
  db: Tx = getDb(),
): Promise<Vehicle> {
  await getCustomer(actor.shopId, customerId, db);
  const { vinOverride, vin, ...rest } = input;
  const [row] = await db
    .insert(vehicles)
    .values({
      ...rest,
      year: rest.year ?? null,
      ...checkedVin(actor, { vin, vinOverride }),
      customerId,
      shopId: actor.shopId,
    })
    .returning(vehicleColumns);
  return row!;
}

export async function updateVehicle(
  actor: Member,
  vehicleId: string,
  input: VehicleFields & { customerId: string },
): Promise<Vehicle> {
  await getCustomer(actor.shopId, input.customerId);
  const { vinOverride, vin, customerId, ...rest } = input;
  const [row] = await getDb()
    .update(vehicles)
    .set({
      ...rest,
      customerId,
      year: rest.year ?? null,
      ...checkedVin(actor, { vin, vinOverride }),
    })
    .where(and(eq(vehicles.shopId, actor.shopId), eq(vehicles.id, vehicleId)))
    .returning(vehicleColumns);
  if (!row) throw notFound('That vehicle');
  return row;
}
