import { z } from 'zod';
import { ids, vehicleSchema } from '@/features/jobs/schemas';
import { getVehicle, updateVehicle } from '@/features/jobs/server/customers';
import { apiRoute } from '@/server/http/handler';

const params = z.object({ vehicleId: ids.vehicle });

export const GET = apiRoute({ permission: 'jobs.create', params }, async ({ member, params }) => ({
  data: await getVehicle(member.shopId, params.vehicleId),
}));

export const PATCH = apiRoute(
  { permission: 'jobs.edit', params, body: vehicleSchema },
  async ({ member, params, body }) => ({
    data: await updateVehicle(member, params.vehicleId, body),
  }),
);
