import { describe, expect, it } from 'vitest';
import { returnPath, signInThenBackTo } from '@/server/auth/return-path';

describe('returnPath (where sign-in sends you back)', () => {
  it('keeps a path on this site, with its query', () => {
    expect(returnPath('/jobs/1/wheels/2/run')).toBe('/jobs/1/wheels/2/run');
    expect(returnPath('/board?state=open')).toBe('/board?state=open');
  });

  it('refuses anything that a browser would take to another host', () => {
    for (const bad of ['//evil.example/x', '/\\evil.example', 'https://evil.example/', 'evil.example', '/ /x', 'javascript:alert(1)', '', 42, undefined, `/${'a'.repeat(300)}`]) {
      expect(returnPath(bad), String(bad)).toBeNull();
    }
  });

  it('round-trips through the sign-in link', () => {
    const link = new URL(signInThenBackTo('/jobs/1/wheels/2/run?x=1&y=2'), 'http://app.test');
    expect(link.pathname).toBe('/sign-in');
    expect(returnPath(link.searchParams.get('next'))).toBe('/jobs/1/wheels/2/run?x=1&y=2');
  });
});
