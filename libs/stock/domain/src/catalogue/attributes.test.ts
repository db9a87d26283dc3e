import { describe, expect, it } from 'vitest';
import { attributeProblems, ATTRIBUTE_FIELDS, PRODUCT_KINDS } from './attributes';

describe('attributes by kind', () => {
  it('every kind has a field list', () => {
    for (const kind of PRODUCT_KINDS) expect(ATTRIBUTE_FIELDS[kind]).toBeDefined();
  });

  it('accepts what a tile records', () => {
    expect(
      attributeProblems('tile', { colour: 'Slate', thicknessMm: 7, finish: 'coin', pitchMm: 500 }),
    ).toEqual([]);
  });

  it('names an attribute the kind does not have, and a fractional length', () => {
    const problems = attributeProblems('skirting', { pitchMm: 500, lengthMm: 2500.5 });
    expect(problems.map((p) => p.field)).toEqual(['attributes.pitchMm', 'attributes.lengthMm']);
    expect(problems[1].message).toMatch(/whole number of millimetres/);
  });

  it('refuses a colour that is not text', () => {
    expect(attributeProblems('tile', { colour: 7 })[0].field).toBe('attributes.colour');
  });
});
