import 'server-only';
import { z } from 'zod';

export const pageQuery = z.object({
  page: z.coerce
    .number({ error: 'page must be a number.' })
    .int()
    .min(1, { error: 'page starts at 1.' })
    .max(100_000, { error: 'page is at most 100000.' })
    .default(1),
  pageSize: z.coerce
    .number({ error: 'pageSize must be a number.' })
    .int()
    .min(1)
    .max(100, { error: 'pageSize is at most 100.' })
    .default(25),
});

/** For short per-shop lists (specs, wrenches) already read whole: one page of them. */
export function pageOf<T>(all: T[], q: z.infer<typeof pageQuery>) {
  return {
    data: all.slice((q.page - 1) * q.pageSize, q.page * q.pageSize),
    page: q.page,
    pageSize: q.pageSize,
    total: all.length,
  };
}
