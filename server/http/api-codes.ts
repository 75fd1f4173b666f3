// No `server-only` here: the runner's answer reader (features/runner/api/post-events.ts) runs in
// the browser and must match the code the handler sends. Nothing in it is secret.

/**
 * The JSON API's code for a write refused for its Origin (`CrossOriginRefused`). The runner keeps
 * and retries events refused with it, so the handler and the reader share this one constant.
 */
export const CROSS_ORIGIN_CODE = 'cross_origin';
