import { BASE_UNIT, DIMENSIONS, exampleOf, fromBaseUnit, parseQuantity, QuantityParseError, toBaseUnit, unitsOf } from '../../src/io/quantity';

/*
 * Speeds typed by people (second sound, a fitted effective speed): m/s, cm/s, mm/s.
 */

const SI_PREFIX = 'SI prefix on the metre (BIPM SI Brochure, 9th ed., Table 7; exact)';
const BARE = 'bare number = SI base unit (this module’s rule)';

describe('parseQuantity: speeds', () => {
  const cases: readonly [text: string, expected: number, source: string][] = [
    ['20m/s', 20, 'metre per second is the base unit'],
    ['19.9 m/s', 19.9, 'metre per second is the base unit'],
    ['1990 cm/s', 19.9, SI_PREFIX],
    ['19900mm/s', 19.9, SI_PREFIX],
    ['5 mm/s', 0.005, SI_PREFIX],
    ['-3 m/s', -3, 'a sign is kept; ranges are the callers’ business'],
    ['2.5e1', 25, BARE],
  ];
  it.each(cases)('%s is %s m/s (%s)', (text, expected) => {
    expect(parseQuantity(text, 'speed')).toBe(expected);
  });

  it('every speed unit appears in the table above, base unit first, with an example that parses', () => {
    const typed = new Set(cases.map(([text]) => text.replace(/^[\s\d.eE+-]+/, '').trim()));
    for (const unit of unitsOf('speed')) expect(typed).toContain(unit);
    expect(unitsOf('speed')[0]).toBe(BASE_UNIT.speed);
    expect(parseQuantity(exampleOf('speed'), 'speed')).toBe(20);
    expect(DIMENSIONS).toContain('speed');
  });

  it('refuses other units and nonsense with the accepted units named', () => {
    expect(() => parseQuantity('20 km/h', 'speed')).toThrow(/unknown unit "km\/h".*m\/s, cm\/s, mm\/s/);
    expect(() => parseQuantity('20 m', 'speed')).toThrow(QuantityParseError);
    expect(() => parseQuantity('fast', 'speed')).toThrow(/does not start with a number/);
    expect(() => parseQuantity('Infinity m/s', 'speed')).toThrow(/finite/);
    expect(() => parseQuantity('20 m/s', 'length')).toThrow(QuantityParseError);
  });

  it('converts both ways at the edge', () => {
    expect(toBaseUnit(1990, 'cm/s')).toBe(19.9);
    expect(fromBaseUnit(19.9, 'mm/s')).toBeCloseTo(19900, 9);
    expect(fromBaseUnit(0.5, 'cm/s')).toBe(50);
  });
});
