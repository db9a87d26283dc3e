import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  formatReference,
  isValidPrefix,
  normaliseReference,
  parseReference,
  prefixProblem,
} from './references';

// Source: the tenant settings schema (libs/identity/server/src/settings.endpoints.ts: zod
// trim, max 12, letters, digits, "-" and "/"), restated character by character; the domain
// library's lint rules keep zod out of its tests.
const ALLOWED = new Set('ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-/');
const settingsAccepts = (s: string) => {
  const t = s.trim();
  return t.length <= 12 && [...t].every((c) => ALLOWED.has(c));
};

describe('formatReference', () => {
  it('pads to five digits after the prefix (issue 5 example: J-00042)', () => {
    expect(formatReference('J-', 42)).toBe('J-00042');
    expect(formatReference('', 7)).toBe('00007');
    expect(formatReference('LW/24/', 1)).toBe('LW/24/00001');
  });

  it('grows past the padding instead of wrapping (common practice)', () => {
    expect(formatReference('J-', 99_999)).toBe('J-99999');
    expect(formatReference('J-', 100_000)).toBe('J-100000');
  });

  it('refuses numbers the database never hands out and bad prefixes', () => {
    for (const n of [0, -1, 1.5, Number.NaN, 2 ** 53]) {
      expect(() => formatReference('J-', n)).toThrow(RangeError);
    }
    expect(() => formatReference('J_', 1)).toThrow(/letters, digits/);
  });
});

describe('parseReference', () => {
  it('round-trips every number and prefix (property)', () => {
    const prefixArb = fc.stringMatching(/^[A-Za-z0-9\-/]{0,12}$/);
    fc.assert(
      fc.property(prefixArb, fc.integer({ min: 1, max: 10_000_000 }), (prefix, n) => {
        expect(parseReference(formatReference(prefix, n), prefix)).toBe(n);
      }),
    );
  });

  it('forgives case, spaces and missing padding; never another prefix', () => {
    expect(parseReference('  j-42 ', 'J-')).toBe(42);
    expect(parseReference('J-00042', 'Q-')).toBeNull();
    expect(parseReference('J-', 'J-')).toBeNull();
    expect(parseReference('J-00000', 'J-')).toBeNull();
    expect(parseReference('J-4a2', 'J-')).toBeNull();
    expect(parseReference('J--42', 'J-')).toBeNull();
    expect(normaliseReference('j-42', 'J-')).toBe('J-00042');
    expect(normaliseReference('nope', 'J-')).toBeNull();
  });

  it('a prefix ending in digits still parses unambiguously, knowing the prefix', () => {
    expect(formatReference('J24', 42)).toBe('J2400042');
    expect(parseReference('J2400042', 'J24')).toBe(42);
  });
});

describe('prefix rule agrees with tenant settings', () => {
  it('for arbitrary strings (property, against the settings rule)', () => {
    const chars = fc.constantFrom(...'Aa9-/_ .#éJ'.split(''));
    const arb = fc.oneof(
      fc.string(),
      fc.array(chars, { maxLength: 16 }).map((a) => a.join('')),
    );
    fc.assert(
      fc.property(arb, (s) => {
        expect(isValidPrefix(s)).toBe(settingsAccepts(s));
      }),
      { numRuns: 2000 },
    );
  });

  it('says why in words', () => {
    expect(prefixProblem('ABCDEFGHIJKLM')).toMatch(/at most 12/);
    expect(prefixProblem('J#')).toMatch(/letters, digits/);
    expect(prefixProblem('INV-2024/')).toBeNull();
  });
});
