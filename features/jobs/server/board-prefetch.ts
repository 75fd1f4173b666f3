import 'server-only';
import { dehydrate, QueryClient, type DehydratedState } from '@tanstack/react-query';
import type { Member } from '@/server/auth/session';
import { boardFiltersFrom, jobsQueryOptions } from '../api/get-jobs';
import { boardQuerySchema } from '../schemas';
import { listBoard } from './board';

/**
 * The board's first page, read on the server under the same query key the browser uses, so the
 * first HTML already holds the job cards and TanStack Query takes over from there. A fresh client
 * per request: a shared one would hand one member's board to another. Filters the API would
 * refuse are not prefetched; the browser asks and shows the API's message.
 */
export async function prefetchBoard(
  member: Member,
  searchParams: Record<string, string | string[] | undefined>,
  defaultAssignee?: string,
): Promise<DehydratedState> {
  const client = new QueryClient();
  const one = (key: string) => {
    const value = searchParams[key];
    return Array.isArray(value) ? value[0] : value;
  };
  const { api } = boardFiltersFrom(one, defaultAssignee);
  const query = boardQuerySchema.safeParse(
    Object.fromEntries(Object.entries(api).filter(([, v]) => v !== undefined)),
  );
  if (query.success) {
    await client.prefetchQuery({
      queryKey: jobsQueryOptions(api).queryKey,
      queryFn: () => listBoard(member, query.data),
    });
  }
  return dehydrate(client);
}
