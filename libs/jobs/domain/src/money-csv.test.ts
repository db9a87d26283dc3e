import Decimal from 'decimal.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { csvDocument, csvField, csvRow } from './csv';
import { addMinor, formatMinor, parseMoneyToMinor } from './money';

/**
 * A reader written straight from the grammar of RFC 4180 §2 (ABNF):
 *   field = escaped / non-escaped; escaped = DQUOTE *(TEXTDATA / COMMA / CR / LF / 2DQUOTE)
 *   DQUOTE; non-escaped = *TEXTDATA; records separated by CRLF.
 * TEXTDATA is widened from printable ASCII to any character but quote, comma, CR and LF so
 * that names with accents round-trip.
 */
function readRfc4180(text: string): string[][] {
  const records: string[][] = [];
  let record: string[] = [];
  const field = /("(?:[^"]|"")*"|[^",\r\n]*)(,|\r\n|$)/y;
  let at = 0;
  while (at < text.length) {
    field.lastIndex = at;
    const m = field.exec(text);
    if (!m) throw new Error(`not RFC 4180 at ${at}`);
    const raw = m[1];
    record.push(raw.startsWith('"') ? raw.slice(1, -1).replaceAll('""', '"') : raw);
    at = field.lastIndex;
    if (m[2] !== ',') {
      records.push(record);
      record = [];
      if (m[2] === '') break;
    }
  }
  return records;
}

describe('CSV writing (RFC 4180)', () => {
  it('rule 6: fields with commas, quotes or line breaks are enclosed in double quotes', () => {
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('line 1\r\nline 2')).toBe('"line 1\r\nline 2"');
    expect(csvField('line 1\nline 2')).toBe('"line 1\nline 2"');
    expect(csvField('plain')).toBe('plain');
  });

  it('rule 7: a quote inside is escaped by a second quote ("b""bb")', () => {
    // RFC 4180 §2.7's own example: "aaa","b""bb","ccc"
    expect(csvField('b"bb')).toBe('"b""bb"');
    expect(csvRow(['aaa', 'b"bb', 'ccc'])).toBe('aaa,"b""bb",ccc');
  });

  it('rules 1–2: records end with CRLF; null becomes an empty field', () => {
    expect(
      csvDocument([
        ['a', null, 3],
        ['x', undefined, -1.5],
      ]),
    ).toBe('a,,3\r\nx,,-1.5\r\n');
    expect(csvDocument([['é']], { bom: true })).toBe('\uFEFFé\r\n');
  });

  it('any fields round-trip through a reader of the RFC grammar (property)', () => {
    const cell = fc.string({ unit: fc.constantFrom('a', 'é', ' ', ',', '"', '\r', '\n', '1') });
    fc.assert(
      fc.property(
        fc.array(fc.array(cell, { minLength: 1, maxLength: 6 }), { maxLength: 5 }),
        (rows) => {
          const text = csvDocument(rows, { guardFormulas: false });
          expect(readRfc4180(text)).toEqual(rows);
        },
      ),
      { numRuns: 500 },
    );
  });

  it('guards formula-like text (OWASP CSV injection) but not plain numbers', () => {
    expect(csvField('=HYPERLINK("x")')).toBe('"\'=HYPERLINK(""x"")"');
    expect(csvField('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvField('-12.50')).toBe('-12.50');
    expect(csvField('+44 20 7946 0000')).toBe("'+44 20 7946 0000");
    expect(csvField('=1', { guardFormulas: false })).toBe('=1');
    expect(() => csvField(Number.NaN)).toThrow(RangeError);
  });
});

describe('money as minor units', () => {
  it('formatMinor agrees with decimal.js (general-purpose library) for any amount', () => {
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), fc.integer({ min: 0, max: 3 }), (v, d) => {
        expect(formatMinor(v, d)).toBe(new Decimal(v).div(new Decimal(10).pow(d)).toFixed(d));
      }),
    );
  });

  it('parseMoneyToMinor reads what formatMinor writes, and what people type', () => {
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), (v) => {
        expect(parseMoneyToMinor(formatMinor(v))).toBe(v);
      }),
    );
    expect(parseMoneyToMinor('1,250.00')).toBe(125000);
    expect(parseMoneyToMinor('£1250')).toBe(125000);
    expect(parseMoneyToMinor(' € 99.5 ')).toBe(9950);
    expect(parseMoneyToMinor('-£3.20')).toBe(-320);
    expect(parseMoneyToMinor('1500', 0)).toBe(1500);
    for (const bad of ['', '12.345', '1,25.00', 'abc', '1.2.3', '12,50']) {
      expect(parseMoneyToMinor(bad)).toBeNull();
    }
  });

  it('addMinor refuses totals past exact integers', () => {
    expect(addMinor(2, 3)).toBe(5);
    expect(() => addMinor(Number.MAX_SAFE_INTEGER, 1)).toThrow(RangeError);
  });
});
