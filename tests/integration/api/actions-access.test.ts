import { beforeAll, describe, expect, it } from 'vitest';
import { can } from '@/server/auth/permissions';
import type { Member } from '@/server/auth/session';
import {
  ACTION_CASES,
  createWorld,
  loadActions,
  outcome,
  type AnyAction,
  type World,
} from '@/tests/helpers/actions';
import { actAs, resetNextRequest } from '@/tests/helpers/next-request';

// Every server action × lead / technician / apprentice / signed out / another shop's lead, held
// against the role table (server/auth/permissions.ts) and the shop scoping of rows.
let world: World, actions: Map<string, AnyAction>;

beforeAll(async () => {
  world = await createWorld();
  actions = await loadActions();
});

describe('the action table covers every server action in the source', () => {
  it('each exported action has an entry, and each entry names an action that exists', () => {
    const found = [...actions.keys()].sort();
    expect(found.length).toBeGreaterThan(15);
    expect(
      found.filter((name) => !(name in ACTION_CASES)),
      'actions without an access entry in tests/helpers/actions.ts',
    ).toEqual([]);
    expect(
      Object.keys(ACTION_CASES).filter((name) => !actions.has(name)),
      'entries for actions that no longer exist',
    ).toEqual([]);
  });
});

type Caller = 'lead' | 'technician' | 'apprentice' | 'signedOut' | 'otherShop';
const CALLERS: Caller[] = ['lead', 'technician', 'apprentice', 'signedOut', 'otherShop'];

function expected(name: string, caller: Caller): string {
  const c = ACTION_CASES[name]!;
  if (c.permission === 'public' || c.permission === 'session') return c.publicGets ?? 'ok';
  if (caller === 'signedOut') return 'unauthenticated';
  if (caller === 'otherShop') return c.otherShop;
  if (!can(caller, c.permission)) return 'forbidden';
  return c.asAllowed?.[caller] ?? 'ok';
}

function member(caller: Caller): Member | null {
  if (caller === 'signedOut') return null;
  return caller === 'otherShop' ? world.b.lead : world.a[caller];
}

describe.each(Object.keys(ACTION_CASES))('%s', (name) => {
  it.each(CALLERS)('as %s: refused or scoped as the role table says', async (caller) => {
    const action = actions.get(name);
    if (!action) return; // reported by the coverage test above
    const who = member(caller);
    const input = await ACTION_CASES[name]!.input(world, who);
    if (who) await actAs(who.userId);
    else resetNextRequest();
    const { code, result } = await outcome(action, input);
    const want = expected(name, caller);
    expect(code, JSON.stringify(result)).toBe(want);
  });
});
