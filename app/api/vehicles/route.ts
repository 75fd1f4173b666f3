import { ids, vehicleSchema } from '@/features/jobs/schemas';
import { createVehicle, listVehicles } from '@/features/jobs/server/customers';
import { apiRoute } from '@/server/http/handler';
import { pageQuery } from '@/server/http/paginate';

export const GET = apiRoute(
  { permission: 'jobs.create', query: pageQuery.extend({ customerId: ids.customer.optional() }) },
  ({ member, query }) => listVehicles(member.shopId, query),
);

export const POST = apiRoute(
  { permission: 'jobs.create', body: vehicleSchema, status: 201 },
  async ({ member, body: { customerId, ...vehicle } }) => ({
    data: await createVehicle(member, customerId, vehicle),
  }),
);
