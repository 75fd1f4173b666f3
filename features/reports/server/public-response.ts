import 'server-only';

/** The same plain 404 for every token that opens nothing, so a response tells nothing about why. */
export function publicNotFound() {
  return new Response('Report not found.', {
    status: 404,
    headers: {
      'content-type': 'text/plain; charset=utf-8',
      'cache-control': 'no-store',
      'x-robots-tag': 'noindex, nofollow',
    },
  });
}
