import { z } from 'zod';
import { customerSchema, ids } from '@/features/jobs/schemas';
import { getCustomer, updateCustomer } from '@/features/jobs/server/customers';
import { apiRoute } from '@/server/http/handler';

const params = z.object({ customerId: ids.customer });

export const GET = apiRoute({ permission: 'jobs.create', params }, async ({ member, params }) => ({
  data: await getCustomer(member.shopId, params.customerId),
}));

export const PATCH = apiRoute(
  { permission: 'jobs.edit', params, body: customerSchema },
  async ({ member, params, body }) => ({
    data: await updateCustomer(member, params.customerId, body),
  }),
);
