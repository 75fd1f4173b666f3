import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { returnPath, signInThenBackTo } from '@/server/auth/return-path';

describe('returnPath (where sign-in sends you back)', () => {
  it('keeps a path on this site, with its query', () => {
    expect(returnPath('/jobs/1/wheels/2/run')).toBe('/jobs/1/wheels/2/run');
    expect(returnPath('/board?state=open')).toBe('/board?state=open');
    expect(returnPath('/jobs/./1/../2')).toBe('/jobs/2');
  });

  it('refuses anything that a browser would take to another host', () => {
    for (const bad of [
      '//evil.example/x',
      '/\\evil.example',
      'https://evil.example/',
      'evil.example',
      '/ /x',
      'javascript:alert(1)',
      '',
      42,
      undefined,
      `/${'a'.repeat(300)}`,
    ]) {
      expect(returnPath(bad), String(bad)).toBeNull();
    }
  });

  it('refuses paths that become another host once dots are resolved or escapes decoded', () => {
    for (const bad of [
      '/.//evil.test/x',
      '/a/../..//evil.test',
      '/%2e//evil.test',
      '/%2F%2Fevil.test',
      '/%2F/evil.test',
      '/%5Cevil.test',
      '/%252F%252Fevil.test',
      '/\t/evil.test',
      '/%09/evil.test',
      '/%zz',
    ]) {
      expect(returnPath(bad), bad).toBeNull();
    }
  });

  it('round-trips through the sign-in link', () => {
    const link = new URL(signInThenBackTo('/jobs/1/wheels/2/run?x=1&y=2'), 'http://app.test');
    expect(link.pathname).toBe('/sign-in');
    expect(returnPath(link.searchParams.get('next'))).toBe('/jobs/1/wheels/2/run?x=1&y=2');
  });
});

// Pieces an attacker would combine: slashes, backslashes, dots, their percent-encodings (once and
// twice), control characters and other hosts.
const piece = fc.oneof(
  fc.constantFrom(
    '/',
    '//',
    '\\',
    '.',
    '..',
    './',
    '../',
    '%2e',
    '%2E',
    '%2e%2e',
    '%2f',
    '%2F',
    '%5c',
    '%5C',
    '%252f',
    '%25',
    '%',
    '?',
    '#',
    '@',
    ':',
    '\t',
    '\n',
    '\r',
    ' ',
    '\u0000',
    '\u007f',
    'evil.test',
    'http:',
    'javascript:',
    '/board',
    'jobs',
    '1',
    'é',
    '\u3000',
  ),
  fc.string({ maxLength: 4 }),
  fc.webSegment(),
);
const candidate = fc.oneof(
  fc.array(piece, { maxLength: 12 }).map((parts) => parts.join('')),
  fc.array(piece, { maxLength: 12 }).map((parts) => `/${parts.join('')}`),
  fc.webUrl({ withQueryParameters: true, withFragments: true }),
  fc.webPath(),
);

const BASES = [
  'https://shop.ringpass.test',
  'http://127.0.0.1:3000/jobs/1/wheels/2/run',
  'https://a.test/deep/path/',
];

function decodedForms(path: string): string[] {
  const forms = [path];
  for (let i = 0; i < 3; i++) {
    try {
      const next = decodeURIComponent(forms.at(-1)!);
      if (next === forms.at(-1)) break;
      forms.push(next);
    } catch {
      break;
    }
  }
  return forms;
}

describe('returnPath, for any input (property)', () => {
  it('answers null or a path that a browser resolves on this site, before and after decoding', () => {
    fc.assert(
      fc.property(candidate, (raw) => {
        const result = returnPath(raw);
        if (result === null) return;
        expect(result.startsWith('/')).toBe(true);
        expect(result[1] === '/' || result[1] === '\\').toBe(false);
        expect(/[\u0000-\u0020\u007f\\]/.test(result)).toBe(false);
        for (const base of BASES) {
          for (const form of decodedForms(result.split('?')[0]!)) {
            expect(new URL(form, base).origin, `${JSON.stringify(raw)} → ${form} on ${base}`).toBe(
              new URL(base).origin,
            );
          }
        }
        expect(returnPath(result)).toBe(result); // stable: checking again changes nothing
      }),
      { numRuns: 5000 },
    );
  });
});
