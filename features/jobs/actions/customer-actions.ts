'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { memberAction } from '@/server/action';
import { customerSchema, ids, vehicleSchema } from '../schemas';
import { createCustomer, createVehicle, updateCustomer } from '../server/customers';

export const addCustomer = memberAction(
  { permission: 'jobs.create', schema: customerSchema },
  async (input, member) => {
    const customer = await createCustomer(member, input);
    revalidatePath('/customers');
    redirect(`/customers/${customer.id}`);
  },
);

export const editCustomer = memberAction(
  { permission: 'jobs.edit', schema: customerSchema.extend({ customerId: ids.customer }) },
  async ({ customerId, ...input }, member) => {
    const customer = await updateCustomer(member, customerId, input);
    revalidatePath(`/customers/${customerId}`);
    return customer;
  },
);

export const addVehicle = memberAction(
  { permission: 'jobs.create', schema: vehicleSchema },
  async ({ customerId, ...input }, member) => {
    const vehicle = await createVehicle(member, customerId, input);
    revalidatePath(`/customers/${customerId}`);
    return vehicle;
  },
);
