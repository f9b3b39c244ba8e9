import fc from 'fast-check';
import {
  BASE_UNIT,
  type Dimension,
  fromBaseUnit,
  parseHeatFlux_W_m2,
  parseLength_m,
  parsePower_W,
  parsePressure_Pa,
  parseQuantity,
  parseTemperature_K,
  parseTime_s,
  QuantityParseError,
  toBaseUnit,
  type Unit,
  unitsOf,
} from '../../src/io/quantity';

// Sources of the expectations below. Every factor is exact by definition, and parsing shifts the
// decimal exponent in the text, so each expectation is the double nearest the exact value: the
// tables compare with toBe, not a tolerance.
const SI_PREFIX = 'SI prefix (exact)';
const TORR = 'torr = 101325/760 Pa (definition, exact)';
const ATM = 'standard atmosphere = 101325 Pa (CGPM 1954, exact)';
const BAR = 'bar = 1e5 Pa, mbar = 100 Pa (definition, exact)';
const BARE = 'bare number = SI base unit (this module’s rule)';
const AREA = 'cm² = 1e-4 m², mm² = 1e-6 m² (SI prefix, squared; exact)';

const DIMENSIONS: readonly Dimension[] = ['temperature', 'pressure', 'length', 'time', 'heat flux', 'power'];

describe('parseQuantity: every unit, as typed', () => {
  const cases: readonly [text: string, dimension: Dimension, expected: number, source: string][] = [
    ['1.8K', 'temperature', 1.8, 'kelvin is the base unit'],
    ['1.8 K', 'temperature', 1.8, 'kelvin is the base unit'],
    ['1800mK', 'temperature', 1.8, SI_PREFIX],
    ['1800 mK', 'temperature', 1.8, SI_PREFIX],
    ['1.8', 'temperature', 1.8, BARE],
    ['  1.8K  ', 'temperature', 1.8, 'surrounding spaces ignored'],
    ['+1.8K', 'temperature', 1.8, 'explicit sign'],
    ['-1.8K', 'temperature', -1.8, 'sign kept; ranges are checked by the caller'],
    ['.5K', 'temperature', 0.5, 'no leading digit'],
    ['2.K', 'temperature', 2, 'trailing point'],
    ['1.8E3mK', 'temperature', 1.8, `${SI_PREFIX}; capital exponent`],
    ['0.3mK', 'temperature', 0.0003, SI_PREFIX],
    ['1638Pa', 'pressure', 1638, 'pascal is the base unit'],
    ['1.6e3Pa', 'pressure', 1600, 'scientific notation'],
    ['1.6e3 Pa', 'pressure', 1600, 'scientific notation, spaced'],
    ['1638', 'pressure', 1638, BARE],
    ['1.638kPa', 'pressure', 1638, SI_PREFIX],
    ['16.38mbar', 'pressure', 1638, BAR],
    ['1.01325bar', 'pressure', 101325, BAR],
    ['760torr', 'pressure', 101325, TORR],
    ['1 torr', 'pressure', 101325 / 760, TORR],
    ['1Torr', 'pressure', 101325 / 760, `${TORR}; capital T accepted`],
    ['1atm', 'pressure', 101325, ATM],
    ['0.5 atm', 'pressure', 50662.5, ATM],
    ['1m', 'length', 1, 'metre is the base unit'],
    ['5cm', 'length', 0.05, SI_PREFIX],
    ['50mm', 'length', 0.05, SI_PREFIX],
    ['120um', 'length', 0.00012, SI_PREFIX],
    ['120µm', 'length', 0.00012, `${SI_PREFIX}; micro sign U+00B5`],
    ['120μm', 'length', 0.00012, `${SI_PREFIX}; Greek mu U+03BC`],
    ['0.05', 'length', 0.05, BARE],
    ['2s', 'time', 2, 'second is the base unit'],
    ['2.5ms', 'time', 0.0025, SI_PREFIX],
    ['2.5 ms', 'time', 0.0025, SI_PREFIX],
    ['400us', 'time', 0.0004, SI_PREFIX],
    ['400µs', 'time', 0.0004, `${SI_PREFIX}; micro sign U+00B5`],
    ['400μs', 'time', 0.0004, `${SI_PREFIX}; Greek mu U+03BC`],
    ['80ns', 'time', 8e-8, SI_PREFIX],
    ['0.0025', 'time', 0.0025, BARE],
    ['1000W/m2', 'heat flux', 1000, 'watt per square metre is the base unit'],
    ['1000 W/m²', 'heat flux', 1000, 'superscript two accepted'],
    ['1W/cm2', 'heat flux', 1e4, AREA],
    ['0.1 W/cm2', 'heat flux', 1000, AREA],
    ['2W/cm²', 'heat flux', 2e4, `${AREA}; superscript two`],
    ['100mW/cm2', 'heat flux', 1000, `${AREA}; ${SI_PREFIX}`],
    ['100 mW/cm²', 'heat flux', 1000, `${AREA}; ${SI_PREFIX}`],
    ['0.01W/mm2', 'heat flux', 1e4, AREA],
    ['1 W/mm²', 'heat flux', 1e6, AREA],
    ['1e4', 'heat flux', 1e4, BARE],
    ['2W', 'power', 2, 'watt is the base unit'],
    ['20mW', 'power', 0.02, SI_PREFIX],
    ['500uW', 'power', 0.0005, SI_PREFIX],
    ['500µW', 'power', 0.0005, `${SI_PREFIX}; micro sign U+00B5`],
    ['500μW', 'power', 0.0005, `${SI_PREFIX}; Greek mu U+03BC`],
    ['0.5', 'power', 0.5, BARE],
  ];
  it.each(cases)('%s as %s is %s (%s)', (text, dimension, expected) => {
    expect(parseQuantity(text, dimension)).toBe(expected);
  });

  it('every unit of every dimension appears in the table above', () => {
    const typed = new Set(cases.map(([text, dimension]) => `${dimension}:${text.replace(/^[\s\d.eE+-]+/, '').trim()}`));
    for (const dimension of DIMENSIONS) {
      for (const unit of unitsOf(dimension)) expect(typed).toContain(`${dimension}:${unit}`);
    }
  });
});

describe('named parsers return the SI base unit', () => {
  it('parseTemperature_K reads millikelvin as kelvin', () => {
    expect(parseTemperature_K('1800mK')).toBe(1.8);
  });
  it('parsePressure_Pa reads atmospheres as pascal', () => {
    expect(parsePressure_Pa('1atm')).toBe(101325);
  });
  it('parseLength_m reads millimetres as metres', () => {
    expect(parseLength_m('50mm')).toBe(0.05);
  });
  it('parseTime_s reads milliseconds as seconds', () => {
    expect(parseTime_s('2.5ms')).toBe(0.0025);
  });
  it('parseHeatFlux_W_m2 reads watts per square centimetre as W/m²', () => {
    expect(parseHeatFlux_W_m2('1W/cm2')).toBe(1e4); // 1 cm² = 1e-4 m² (exact)
  });
  it('parsePower_W reads milliwatts as watts', () => {
    expect(parsePower_W('20mW')).toBe(0.02);
  });
});

describe('parseQuantity: typed errors', () => {
  const cases: readonly [text: string, dimension: Dimension, problem: QuantityParseError['problem']][] = [
    ['', 'temperature', 'empty'],
    ['   ', 'pressure', 'empty'],
    ['abc', 'temperature', 'not-a-number'],
    ['K', 'temperature', 'not-a-number'],
    ['e3K', 'temperature', 'not-a-number'],
    ['NaN', 'temperature', 'non-finite'],
    ['nan K', 'temperature', 'non-finite'],
    ['Infinity', 'pressure', 'non-finite'],
    ['-inf', 'length', 'non-finite'],
    ['1e999K', 'temperature', 'non-finite'],
    ['5F', 'temperature', 'unknown-unit'],
    ['1.8 mk', 'temperature', 'unknown-unit'],
    ['1.8 Kelvin', 'temperature', 'unknown-unit'],
    ['1.8KK', 'temperature', 'unknown-unit'],
    ['1.8 Pa', 'temperature', 'unknown-unit'],
    ['1638 K', 'pressure', 'unknown-unit'],
    ['2 mm', 'time', 'unknown-unit'],
    ['1,8K', 'temperature', 'unknown-unit'],
    ['1 W/cm3', 'heat flux', 'unknown-unit'],
    ['1 W / cm2', 'heat flux', 'unknown-unit'],
    ['1 w/cm2', 'heat flux', 'unknown-unit'],
    ['1W', 'heat flux', 'unknown-unit'],
    ['1 W/cm2', 'power', 'unknown-unit'],
    ['1MW', 'power', 'unknown-unit'],
    ['NaN W', 'power', 'non-finite'],
    ['', 'heat flux', 'empty'],
  ];
  it.each(cases)('%j as %s fails: %s', (text, dimension, problem) => {
    const error = catchError(() => parseQuantity(text, dimension));
    expect(error).toBeInstanceOf(QuantityParseError);
    if (!(error instanceof QuantityParseError)) return;
    expect(error.problem).toBe(problem);
    expect(error.dimension).toBe(dimension);
    expect(error.input).toBe(text);
    expect(error.acceptedUnits).toEqual(unitsOf(dimension));
    // The message names the quantity, what was wrong and the accepted units.
    expect(error.message.startsWith(dimension)).toBe(true);
    expect(error.message).toContain(`accepted units: ${unitsOf(dimension).join(', ')}`);
    expect(error.message).not.toContain('\n');
  });

  it('names the unknown unit', () => {
    expect(() => parseQuantity('5F', 'temperature')).toThrow('unknown unit "F"');
  });

  it('throws nothing but QuantityParseError, whatever the text', () => {
    fc.assert(
      fc.property(fc.string(), fc.constantFrom(...DIMENSIONS), (text, dimension) => {
        try {
          expect(Number.isFinite(parseQuantity(text, dimension))).toBe(true);
        } catch (error) {
          expect(error).toBeInstanceOf(QuantityParseError);
        }
      }),
    );
  });
});

describe('unit conversions at the edge', () => {
  const ALL_UNITS: readonly Unit[] = DIMENSIONS.flatMap((d) => unitsOf(d));

  it('lists the base unit first for each dimension', () => {
    for (const dimension of DIMENSIONS) expect(unitsOf(dimension)[0]).toBe(BASE_UNIT[dimension]);
  });

  const cases: readonly [value: number, unit: Unit, base: number, source: string][] = [
    [1800, 'mK', 1.8, SI_PREFIX],
    [1, 'atm', 101325, ATM],
    [760, 'torr', 101325, TORR],
    [1, 'bar', 1e5, BAR],
    [1, 'mbar', 100, BAR],
    [1, 'kPa', 1000, SI_PREFIX],
    [50, 'mm', 0.05, SI_PREFIX],
    [2.5, 'ms', 0.0025, SI_PREFIX],
    [80, 'ns', 8e-8, SI_PREFIX],
    [1, 'W/cm2', 1e4, AREA],
    [1, 'mW/cm2', 10, AREA],
    [1, 'W/mm2', 1e6, AREA],
    [20, 'mW', 0.02, SI_PREFIX],
    [500, 'uW', 0.0005, SI_PREFIX],
  ];
  it.each(cases)('%s %s is %s in the base unit (%s)', (value, unit, base) => {
    expect(toBaseUnit(value, unit)).toBe(base);
    expect(fromBaseUnit(base, unit)).toBeCloseTo(value, 12);
  });

  it('fromBaseUnit undoes toBaseUnit for every unit', () => {
    // Two correctly rounded operations each way: agreement to a few ulps.
    const ROUND_TRIP_RELATIVE = 1e-15;
    fc.assert(
      fc.property(fc.double({ min: 1e-9, max: 1e9, noNaN: true }), fc.constantFrom(...ALL_UNITS), (x, unit) => {
        const back = fromBaseUnit(toBaseUnit(x, unit), unit);
        expect(Math.abs(back - x)).toBeLessThanOrEqual(ROUND_TRIP_RELATIVE * x);
      }),
    );
  });

  it('parsing "<x><unit>" agrees with toBaseUnit(x, unit)', () => {
    const AGREEMENT_RELATIVE = 1e-15;
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), fc.constantFrom(...DIMENSIONS), (x, dimension) => {
        for (const unit of unitsOf(dimension)) {
          const parsed = parseQuantity(`${x}${unit}`, dimension);
          expect(Math.abs(parsed - toBaseUnit(x, unit))).toBeLessThanOrEqual(AGREEMENT_RELATIVE * parsed);
        }
      }),
    );
  });

  it('rejects a unit symbol it does not know (a programming error)', () => {
    expect(() => toBaseUnit(1, 'furlong' as Unit)).toThrow(RangeError);
    expect(() => fromBaseUnit(1, 'furlong' as Unit)).toThrow(RangeError);
  });
});

function catchError(f: () => unknown): unknown {
  try {
    f();
  } catch (error) {
    return error;
  }
  return undefined;
}
