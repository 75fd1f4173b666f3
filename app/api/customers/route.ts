import { customerSchema } from '@/features/jobs/schemas';
import { createCustomer, listCustomers } from '@/features/jobs/server/customers';
import { searchText } from '@/features/ui/bounded';
import { apiRoute } from '@/server/http/handler';
import { pageQuery } from '@/server/http/paginate';

const query = pageQuery.extend({ q: searchText('the customer search') });

export const GET = apiRoute({ permission: 'jobs.create', query }, ({ member, query }) =>
  listCustomers(member.shopId, query),
);

export const POST = apiRoute(
  { permission: 'jobs.create', body: customerSchema, status: 201 },
  async ({ member, body }) => ({ data: await createCustomer(member, body) }),
);
