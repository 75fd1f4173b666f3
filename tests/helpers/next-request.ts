/**
 * Stands in for Next's request context in integration tests: server actions call cookies() and
 * headers(); here they read and write this in-memory request.
 */
type CookieAttributes = Record<string, unknown>;
const state = {
  cookies: new Map<string, { value: string; attributes?: CookieAttributes }>(),
  headers: new Headers(),
};

export function resetNextRequest(address = '203.0.113.10') {
  state.cookies.clear();
  state.headers = new Headers({ 'x-forwarded-for': address });
}

export function setRequestAddress(address: string) {
  state.headers.set('x-forwarded-for', address);
}

export function cookieValue(name: string) {
  return state.cookies.get(name)?.value;
}

export function cookieAttributes(name: string) {
  return state.cookies.get(name)?.attributes;
}

export const nextHeadersMock = {
  cookies: async () => ({
    get: (name: string) =>
      state.cookies.has(name) ? { name, value: state.cookies.get(name)!.value } : undefined,
    set: (name: string, value: string, attributes?: CookieAttributes) => {
      if (value === '') state.cookies.delete(name);
      else state.cookies.set(name, { value, attributes });
    },
    delete: (name: string) => state.cookies.delete(name),
  }),
  headers: async () => state.headers,
};

/** Signs the in-memory request in as this user, as the session cookie would. */
export async function actAs(userId: string) {
  const { createSessionCookie } = await import('@/server/auth/session');
  resetNextRequest();
  const cookie = await createSessionCookie(userId);
  state.cookies.set(cookie.name, { value: cookie.value });
}
