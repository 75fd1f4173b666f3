import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { getDb } from '@/db';
import { users } from '@/db/schema';
import { getJob } from '@/features/jobs/server/jobs';
import { createAttempt } from '@/features/practice/server/attempts';
import {
  ACTION_CASES,
  createWorld,
  loadActions,
  type AnyAction,
  type World,
} from '@/tests/helpers/actions';
import { apiRequest, cookieFor, params } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { fourWheels, specBody, wrenchBody } from '@/tests/helpers/records';

/**
 * Generated bodies against every route handler (found by reading app/api) and every server
 * action: NUL bytes, lone surrogates, numbers beyond PostgreSQL's integer and JavaScript's dates,
 * NaN-ish strings, nested junk, wrong types, dropped into the fields each endpoint knows. Whatever
 * arrives, the answer is never a 5xx or "internal", and a refusal has the one error shape.
 */
const RUNS = 12; // random cases per endpoint, beside the poisoned fields below: the file stays under a minute

/** Values that reached PostgreSQL unchecked before: each is put into every field of a good body in turn. */
const POISON: unknown[] = [
  'a\u0000b',
  'lone \ud800',
  3e9,
  -1e308,
  'NaN',
  '0000-01-01',
  '0000-01-01T00:00:00Z',
  '+275760-09-13T00:00:00.000Z',
  { nested: [{ junk: true }] },
];
type Path = (string | number)[];
/** Every place in a value a field can be: object keys, the first element of arrays, all the way down. */
function fieldPaths(value: unknown, prefix: Path = []): Path[] {
  if (Array.isArray(value))
    return value.length ? [prefix, ...fieldPaths(value[0], [...prefix, 0])] : [prefix];
  if (value && typeof value === 'object')
    return Object.entries(value).flatMap(([k, v]) => fieldPaths(v, [...prefix, k]));
  return [prefix];
}
function setAt(value: unknown, path: Path, leaf: unknown): unknown {
  if (path.length === 0) return leaf;
  const copy = (Array.isArray(value) ? [...value] : { ...(value as object) }) as Record<
    string | number,
    unknown
  >;
  copy[path[0]!] = setAt(copy[path[0]!], path.slice(1), leaf);
  return copy;
}
/** The good body with one field poisoned, for every field and every poison. */
const poisoned = (good: Record<string, unknown>) =>
  fieldPaths(good)
    .filter((p) => p.length)
    .flatMap((path) =>
      POISON.map((leaf) => ({ path: path.join('.'), body: setAt(good, path, leaf) })),
    );

const routeModules = import.meta.glob<Record<string, unknown>>('/app/api/**/route.ts', {
  eager: true,
});
const METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'] as const;
type Handler = (
  req: Request,
  ctx: { params: Promise<Record<string, string>> },
) => Promise<Response>;

const NASTY_STRINGS = [
  '\u0000',
  'Wren\u0000Halloway',
  '\ud800',
  'tab\tok',
  '\u001b[31m',
  '\u007f',
  'NaN',
  'Infinity',
  '-Infinity',
  '1e400',
  '3e9',
  '-0',
  '0x10',
  '0000-01-01',
  '0000-01-01T00:00:00Z',
  '2026-02-30',
  '1899-12-31',
  '+275760-09-13T00:00:00.000Z',
  '-271821-04-20T00:00:00.000Z',
  '9999-12-31T23:59:59Z',
  '',
  '   ',
  'x'.repeat(3000),
  '%00',
  '__proto__',
  'on',
  'null',
  '[]',
  '{"a":1}',
  '[{"position":"LF"}]',
];
const NASTY_NUMBERS = [
  3e9,
  -3e9,
  2_147_483_648,
  -2_147_483_649,
  Number.MAX_SAFE_INTEGER + 2,
  1e308,
  -1e308,
  8.64e15,
  -8.64e15,
  5e-324,
  -0,
  0,
  -1,
  1.5,
  64,
  65,
];
const nasty = fc.oneof(
  fc.constantFrom(...NASTY_STRINGS),
  fc.constantFrom(...NASTY_NUMBERS),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.integer(),
  fc.double(),
  fc.boolean(),
  fc.constant(null),
  fc.uuid(),
);
const { junk } = fc.letrec((tie) => ({
  junk: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    nasty,
    fc.array(tie('junk'), { maxLength: 3 }),
    fc.dictionary(fc.string({ maxLength: 8 }), tie('junk'), { maxKeys: 3 }),
  ),
}));

/** Field names the app's schemas use, so junk lands where validation must catch it. */
const FIELDS = [
  'name',
  'phone',
  'email',
  'customerId',
  'vehicleId',
  'customer',
  'vehicle',
  'wheels',
  'dueAt',
  'notes',
  'note',
  'assigneeId',
  'position',
  'specId',
  'tireSize',
  'directional',
  'targetPressure',
  'pressureUnit',
  'boltCount',
  'boltThread',
  'finalTorque',
  'torqueUnit',
  'passPercents',
  'patternKind',
  'skipStep',
  'checkPass',
  'lugTorque',
  'lugTorqueUnit',
  'lugCount',
  'maxBeadSeatPressure',
  'runningPressure',
  'makerReference',
  'label',
  'kind',
  'min',
  'max',
  'unit',
  'graduation',
  'serial',
  'calibrationDueOn',
  'cyclesSinceCalibration',
  'referenceValue',
  'readingValue',
  'reason',
  'role',
  'action',
  'year',
  'make',
  'model',
  'description',
  'vin',
  'events',
  'wheelId',
  'jobId',
  'wrenchId',
  'memberId',
  'inviteId',
  'token',
  'password',
  'shopName',
  'pattern',
  'final',
  'fractions',
  'start',
  'wrenches',
  'wrenchIds',
  'timeZone',
  'recheckDays',
  'verification',
];
const QUERY_KEYS = [
  'q',
  'page',
  'pageSize',
  'state',
  'assignee',
  'due',
  'sort',
  'dir',
  'customerId',
  'slug',
  'actionType',
];

/** A good body with some fields replaced by junk, or junk on its own. */
const bodyFrom = (good: Record<string, unknown>) =>
  fc.oneof(
    fc
      .dictionary(fc.constantFrom(...Object.keys(good), ...FIELDS), junk, {
        minKeys: 1,
        maxKeys: 4,
      })
      .map((bad) => ({ ...good, ...bad })),
    fc
      .record({
        events: fc.array(
          fc.dictionary(
            fc.constantFrom('type', 'payload', 'clientId', 'clientAt', 'bolt', 'pass', 'checklist'),
            junk,
            { maxKeys: 4 },
          ),
          { maxLength: 3 },
        ),
      })
      .map((bad) => ({ ...good, ...bad })),
    junk,
  );
const asText = (v: unknown) => (typeof v === 'string' ? v : (JSON.stringify(v) ?? 'undefined'));

let world: World, lead: string, ids: Record<string, string>, actions: Map<string, AnyAction>;
const goodActionInput = new Map<string, Record<string, unknown>>();

beforeAll(async () => {
  world = await createWorld();
  lead = await cookieFor(world.a.lead.userId);
  const [spare] = await getDb()
    .insert(users)
    .values({
      shopId: world.a.shopId,
      role: 'technician',
      name: 'Sam Spare',
      email: `spare-${randomUUID()}@shop.test`,
      passwordHash: 'x',
    })
    .returning({ id: users.id });
  const wheelId = (await getJob(world.a.shopId, world.records.job.id)).wheels[0]!.id;
  const r = world.records;
  ids = {
    jobId: r.job.id,
    wheelId,
    customerId: r.customer.id,
    vehicleId: r.vehicle.id,
    specId: r.spec.id,
    wrenchId: r.wrench.id,
    memberId: spare!.id,
    photoId: randomUUID(),
    attemptId: (await createAttempt(world.a.lead, { source: 'surprise', level: 'guided' })).id,
  };
  actions = await loadActions();
  for (const name of actions.keys()) {
    const c = ACTION_CASES[name];
    if (c)
      goodActionInput.set(
        name,
        ((await c.input(world, world.a.lead)) ?? {}) as Record<string, unknown>,
      );
  }
});

/** Good bodies for the writes, by route file; the rest start from an empty object. */
const GOOD_BODIES: Record<string, () => Record<string, unknown>> = {
  '/app/api/jobs/route.ts': () => ({
    customerId: world.records.customer.id,
    vehicleId: world.records.vehicle.id,
    wheels: fourWheels(world.records.spec.id),
  }),
  '/app/api/jobs/[jobId]/route.ts': () => ({ notes: 'Bring the cage.' }),
  '/app/api/jobs/[jobId]/transitions/route.ts': () => ({ action: 'start', note: '' }),
  '/app/api/jobs/[jobId]/wheels/route.ts': () => ({ ...fourWheels(world.records.spec.id)[0] }),
  '/app/api/wheels/[wheelId]/route.ts': () => ({ ...fourWheels(world.records.spec.id)[0] }),
  '/app/api/wheels/[wheelId]/events/route.ts': () => ({
    events: [
      {
        type: 'bolt_confirmed',
        payload: { pass: 1, bolt: 1 },
        clientId: randomUUID(),
        clientAt: new Date().toISOString(),
      },
    ],
  }),
  '/app/api/customers/route.ts': () => ({ name: 'Nell Orchard', phone: '555-0100' }),
  '/app/api/customers/[customerId]/route.ts': () => ({ name: 'Wren Halloway', phone: '555-0142' }),
  '/app/api/vehicles/route.ts': () => ({
    customerId: world.records.customer.id,
    make: 'Boreal',
    model: 'Scout',
  }),
  '/app/api/vehicles/[vehicleId]/route.ts': () => ({
    customerId: world.records.customer.id,
    make: 'Talonworks',
    model: 'Ridgeback',
  }),
  '/app/api/specs/route.ts': () => ({ ...specBody }),
  '/app/api/specs/[specId]/route.ts': () => ({ ...specBody }),
  '/app/api/wrenches/route.ts': () => ({ ...wrenchBody }),
  '/app/api/wrenches/[wrenchId]/route.ts': () => ({ ...wrenchBody }),
  '/app/api/wrenches/[wrenchId]/verifications/route.ts': () => ({
    referenceValue: 100,
    readingValue: 101,
    unit: 'lbf-in',
  }),
  '/app/api/wrenches/[wrenchId]/clear/route.ts': () => ({ reason: 'recalibrated at the lab' }),
  '/app/api/torque-plans/route.ts': () => ({
    boltCount: 8,
    pattern: { kind: 'cross' },
    final: { value: 10, unit: 'Nm' },
    wrenchIds: [world.records.wrench.id],
  }),
  '/app/api/team/members/[memberId]/route.ts': () => ({ role: 'technician' }),
  '/app/api/practice/attempts/route.ts': () => ({ source: 'surprise', level: 'guided' }),
  '/app/api/practice/attempts/[attemptId]/events/route.ts': () => ({
    events: [
      {
        type: 'bolt_confirmed',
        payload: { pass: 1, bolt: 1 },
        clientId: randomUUID(),
        clientAt: new Date().toISOString(),
      },
    ],
  }),
};

const routes = Object.entries(routeModules).flatMap(([file, mod]) =>
  METHODS.filter((m) => typeof mod[m] === 'function').map((method) => ({
    file,
    method,
    handler: mod[method] as Handler,
  })),
);

// A lone surrogate has no URL form (Next would hand the route U+FFFD); the params still carry it.
const segment = (value: string) => encodeURIComponent(value.replace(/\p{Cs}/gu, '\ufffd'));
function pathFor(file: string, values: Record<string, string>) {
  return file
    .replace(/^\/app/, '')
    .replace(/\/route\.ts$/, '')
    .replace(/\[(\w+)\]/g, (_, name: string) => segment(values[name] ?? name));
}
const paramNames = (file: string) => [...file.matchAll(/\[(\w+)\]/g)].map((m) => m[1]!);

type ApiErrorBody = {
  error?: { code?: unknown; message?: unknown; fields?: Record<string, unknown> };
};

function assertErrorShape(body: ApiErrorBody, context: string) {
  expect(typeof body.error?.code, context).toBe('string');
  expect(body.error?.code, context).not.toBe('internal');
  expect(typeof body.error?.message, context).toBe('string');
  for (const messages of Object.values(body.error?.fields ?? {})) {
    expect(Array.isArray(messages) && messages.every((m) => typeof m === 'string'), context).toBe(
      true,
    );
  }
}

describe('route handlers under generated input', () => {
  it('finds the route handlers by reading app/api', () => {
    expect(routes.length).toBeGreaterThan(25);
  });

  it.each(routes.map((r) => [`${r.method} ${r.file}`, r] as const))(
    '%s: never a 5xx, always the error shape',
    async (_name, route) => {
      const names = paramNames(route.file);
      const paramValues = fc.record(
        Object.fromEntries(
          names.map((n) => [
            n,
            fc.oneof(
              fc.constant(ids[n]!),
              fc.constant(ids[n]!),
              fc.constantFrom(...NASTY_STRINGS).map((s) => s.slice(0, 200)),
            ),
          ]),
        ) as Record<string, fc.Arbitrary<string>>,
      );
      const query = fc.dictionary(fc.constantFrom(...QUERY_KEYS), junk.map(asText), { maxKeys: 4 });
      const good = GOOD_BODIES[route.file]?.() ?? {};
      const call = async (p: Record<string, string>, q: Record<string, string>, body: unknown) => {
        const search = new URLSearchParams(q).toString();
        const path = pathFor(route.file, p) + (search ? `?${search}` : '');
        const withBody = route.method !== 'GET' && route.method !== 'DELETE';
        const res = await route.handler(
          apiRequest(path, {
            method: route.method,
            cookie: lead,
            body: withBody ? body : undefined,
          }),
          params(p),
        );
        const context = `${route.method} ${path} ${withBody ? JSON.stringify(body)?.slice(0, 300) : ''} → ${res.status}`;
        expect(res.status, context).toBeLessThan(500);
        // The upload SDK answers its own protocol's errors in its own shape; ours have one shape.
        if (res.status >= 400 && !route.file.includes('uploadthing'))
          assertErrorShape((await res.json()) as ApiErrorBody, context);
      };
      const own = Object.fromEntries(names.map((n) => [n, ids[n]!]));
      if (route.method === 'GET') {
        for (const key of QUERY_KEYS)
          for (const leaf of POISON) await call(own, { [key]: asText(leaf) }, undefined);
      } else {
        for (const { body } of poisoned(good)) await call(own, {}, body);
      }
      await fc.assert(
        fc.asyncProperty(paramValues, query, bodyFrom(good), (p, q, body) => call(p, q, body)),
        { numRuns: RUNS },
      );
    },
  );
});

describe('server actions under generated input', () => {
  it.each(Object.keys(ACTION_CASES))(
    '%s: never "internal", always the failure shape',
    async (name) => {
      const action = actions.get(name);
      if (!action) return; // the access test reports a missing action
      const good = goodActionInput.get(name) ?? {};
      const asForm = (input: unknown) => {
        const form = new FormData();
        if (input && typeof input === 'object')
          for (const [k, v] of Object.entries(input)) form.set(k, asText(v));
        return form;
      };
      const check = async (input: unknown, form: boolean) => {
        await actAs(world.a.lead.userId);
        const context = JSON.stringify(input)?.slice(0, 300);
        let result:
          | {
              ok?: boolean;
              code?: unknown;
              message?: unknown;
              fieldErrors?: Record<string, unknown>;
            }
          | undefined;
        try {
          result = (await action(null, form ? asForm(input) : input)) as typeof result;
        } catch (error) {
          const digest = (error as { digest?: unknown })?.digest;
          if (typeof digest === 'string' && digest.startsWith('NEXT_')) return; // a redirect after success, or Next's 404
          throw error;
        }
        if (result?.ok !== false) return;
        expect(result.code, context).not.toBe('internal');
        expect(typeof result.code, context).toBe('string');
        expect(typeof result.message, context).toBe('string');
        for (const messages of Object.values(result.fieldErrors ?? {}))
          expect(Array.isArray(messages), context).toBe(true);
      };
      for (const { body } of poisoned(good)) await check(body, false);
      await fc.assert(fc.asyncProperty(bodyFrom(good), fc.boolean(), check), { numRuns: RUNS });
    },
  );
});
