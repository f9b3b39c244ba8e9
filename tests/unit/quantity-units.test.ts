import {
  BASE_UNIT,
  type Dimension,
  exampleOf,
  fromBaseUnit,
  parseQuantity,
  QuantityParseError,
  toBaseUnit,
  unitsOf,
} from '../../src/io/quantity';

/*
 * The dimensions the measurement planner needs beyond the first six: temperature differences
 * (uncertainties), areas, frequencies and sample rates, voltages and responsivities.
 */

const SI_PREFIX = 'SI prefix (BIPM SI Brochure, 9th ed., Table 7; exact)';
const SQUARED = 'SI prefix squared: (10⁻²)² = 10⁻⁴ (SI Brochure §3; exact)';
const SAMPLES = '1 S/s = 1 Hz (a rate of events per second; common practice, no source)';
const BARE = 'bare number = SI base unit (this module’s rule)';

const NEW_DIMENSIONS: readonly Dimension[] = ['temperature difference', 'area', 'frequency', 'voltage', 'responsivity'];

describe('parseQuantity: the planner’s units, as typed', () => {
  const cases: readonly [text: string, dimension: Dimension, expected: number, source: string][] = [
    ['1K', 'temperature difference', 1, 'kelvin is the base unit'],
    ['1 mK', 'temperature difference', 1e-3, SI_PREFIX],
    ['50uK', 'temperature difference', 5e-5, SI_PREFIX],
    ['50 µK', 'temperature difference', 5e-5, `${SI_PREFIX}; micro sign U+00B5`],
    ['50 μK', 'temperature difference', 5e-5, `${SI_PREFIX}; Greek mu U+03BC`],
    ['0.001', 'temperature difference', 1e-3, BARE],
    ['1m2', 'area', 1, 'square metre is the base unit'],
    ['1 m²', 'area', 1, 'superscript two accepted'],
    ['1cm2', 'area', 1e-4, SQUARED],
    ['1 cm²', 'area', 1e-4, SQUARED],
    ['1mm2', 'area', 1e-6, SQUARED],
    ['2 mm²', 'area', 2e-6, SQUARED],
    ['100um2', 'area', 1e-10, SQUARED],
    ['100 µm2', 'area', 1e-10, `${SQUARED}; micro sign`],
    ['100 µm²', 'area', 1e-10, `${SQUARED}; micro sign, superscript two`],
    ['100 μm²', 'area', 1e-10, `${SQUARED}; Greek mu, superscript two`],
    ['100 um²', 'area', 1e-10, `${SQUARED}; u for micro, superscript two`],
    ['1e-4', 'area', 1e-4, BARE],
    ['5Hz', 'frequency', 5, 'hertz is the base unit'],
    ['2.5 kHz', 'frequency', 2500, SI_PREFIX],
    ['10MHz', 'frequency', 1e7, SI_PREFIX],
    ['1 GHz', 'frequency', 1e9, SI_PREFIX],
    ['100 S/s', 'frequency', 100, SAMPLES],
    ['250kS/s', 'frequency', 2.5e5, SAMPLES],
    ['10 MS/s', 'frequency', 1e7, SAMPLES],
    ['1GS/s', 'frequency', 1e9, SAMPLES],
    ['1e7', 'frequency', 1e7, BARE],
    ['1V', 'voltage', 1, 'volt is the base unit'],
    ['20 mV', 'voltage', 0.02, SI_PREFIX],
    ['1uV', 'voltage', 1e-6, SI_PREFIX],
    ['1 µV', 'voltage', 1e-6, `${SI_PREFIX}; micro sign`],
    ['1 μV', 'voltage', 1e-6, `${SI_PREFIX}; Greek mu`],
    ['300 nV', 'voltage', 3e-7, SI_PREFIX],
    ['2V/K', 'responsivity', 2, 'volt per kelvin is the base unit'],
    ['500 mV/K', 'responsivity', 0.5, SI_PREFIX],
    ['20 uV/K', 'responsivity', 2e-5, SI_PREFIX],
    ['20 µV/K', 'responsivity', 2e-5, `${SI_PREFIX}; micro sign`],
    ['20 μV/K', 'responsivity', 2e-5, `${SI_PREFIX}; Greek mu`],
    ['2 V/mK', 'responsivity', 2000, `${SI_PREFIX} in the denominator`],
  ];
  it.each(cases)('%s as %s is %s (%s)', (text, dimension, expected) => {
    expect(parseQuantity(text, dimension)).toBe(expected);
  });

  it('every unit of the new dimensions appears in the table above', () => {
    const typed = new Set(cases.map(([text, dimension]) => `${dimension}:${text.replace(/^[\s\d.eE+-]+/, '').trim()}`));
    for (const dimension of NEW_DIMENSIONS) {
      for (const unit of unitsOf(dimension)) expect(typed).toContain(`${dimension}:${unit}`);
    }
  });

  it('lists the base unit first and has a typed example that parses', () => {
    for (const dimension of NEW_DIMENSIONS) {
      expect(unitsOf(dimension)[0]).toBe(BASE_UNIT[dimension]);
      expect(Number.isFinite(parseQuantity(exampleOf(dimension), dimension))).toBe(true);
    }
  });

  it('keeps dimensions apart: a temperature is not an area, a length is not a voltage', () => {
    expect(() => parseQuantity('1 K', 'area')).toThrow(QuantityParseError);
    expect(() => parseQuantity('1 mm', 'voltage')).toThrow(QuantityParseError);
    expect(() => parseQuantity('1 mm', 'area')).toThrow(/unknown unit "mm"/);
    expect(() => parseQuantity('1 Hz', 'time')).toThrow(QuantityParseError);
  });

  it('is case-sensitive where case changes the size (MHz is not mHz, mV is not MV)', () => {
    expect(() => parseQuantity('1 mHz', 'frequency')).toThrow(/unknown unit "mHz"/);
    expect(() => parseQuantity('1 MV', 'voltage')).toThrow(/unknown unit "MV"/);
  });

  it('converts both ways at the edge', () => {
    expect(toBaseUnit(1, 'cm2')).toBe(1e-4);
    expect(fromBaseUnit(1e-4, 'cm2')).toBeCloseTo(1, 12);
    expect(toBaseUnit(10, 'MS/s')).toBe(1e7);
    expect(fromBaseUnit(5e-5, 'µK')).toBeCloseTo(50, 12);
    expect(fromBaseUnit(2, 'mV/K')).toBeCloseTo(2000, 9);
  });
});
