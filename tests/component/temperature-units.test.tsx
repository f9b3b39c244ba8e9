import { readFieldText } from '../../src/ui/fields/field-spec';
import { TEMPERATURE_FIELD } from '../../src/ui/temperature/TemperatureField';
import { checkTemperature, formatKelvin, formatMillikelvin, TEMPERATURE_RANGE_TEXT } from '../../src/ui/units/temperature-text';

/*
 * The explorer's typed temperature is a quantity field like every other (src/ui/fields): a bare
 * number is in the unit shown (here K), a typed unit wins; units as src/io/quantity.ts reads them
 * (case matters: m is milli, M mega).
 */

// Exact conversions: no tolerance beyond floating-point rounding.
const ACCEPTED: [typed: string, kelvin: number][] = [
  ['1.8', 1.8],
  ['1.8 K', 1.8],
  ['1.8K', 1.8],
  ['1800 mK', 1.8],
  ['1800mK', 1.8],
  ['  2.1768 K  ', 2.1768],
  ['1,8 K', 1.8],
  ['.5', 0.5],
  ['0.3', 0.3],
  ['4.24 K', 4.24],
  ['300 mK', 0.3],
  ['4240 mK', 4.24],
  ['1.8e0 K', 1.8],
];

const REJECTED: [typed: string, why: RegExp][] = [
  ['', /empty/],
  ['   ', /empty/],
  ['abc', /does not start with a number/],
  ['1.8 C', /not a temperature/],
  ['1.8 K K', /not a temperature/],
  ['1800 mk', /not a temperature/],
  ['5 K', /must be 0\.3–4\.24 K; “5 K” is outside/],
  ['0.29999', /must be 0\.3–4\.24 K/],
  ['4.2401', /must be 0\.3–4\.24 K/],
  ['299 mK', /“299 mK” is outside/],
  ['-1 K', /must be 0\.3–4\.24 K/],
  ['\u22121 K', /must be 0\.3–4\.24 K/],
  ['1e999', /not a finite number/],
  ['2000', /A bare number is in K: did you mean 2000 mK\?/],
];

describe('typed temperatures', () => {
  it('states the range in both units', () => {
    expect(TEMPERATURE_RANGE_TEXT).toBe('0.3–4.24 K (300–4240 mK)');
  });

  it.each(ACCEPTED)('reads %j as %f K', (typed, kelvin) => {
    const read = readFieldText(TEMPERATURE_FIELD, typed, 'K');
    expect(read.ok).toBe(true);
    if (read.ok) expect(read.value).toBeCloseTo(kelvin, 12);
  });

  it('reads a bare number in mK when the field shows mK', () => {
    expect(readFieldText(TEMPERATURE_FIELD, '1800', 'mK')).toEqual({ ok: true, value: 1.8 });
  });

  it.each(REJECTED)('rejects %j', (typed, why) => {
    const read = readFieldText(TEMPERATURE_FIELD, typed, 'K');
    expect(read.ok).toBe(false);
    if (!read.ok) {
      expect(read.message).toMatch(why);
      expect(read.message).toMatch(/^Temperature/);
    }
  });

  it.each([Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, 0, -1, 0.2999, 4.2401])(
    'rejects %f K from the slider or a preset',
    (kelvin) => {
      expect(checkTemperature(kelvin).ok).toBe(false);
    },
  );
});

describe('temperature formatting', () => {
  it.each([
    [1.8, '1.8000', '1800.0'],
    [2.1768, '2.1768', '2176.8'],
    [2.17679, '2.17679', '2176.79'],
    [2.176795, '2.176795', '2176.795'],
    [0.3, '0.3000', '300.0'],
  ])('shows %f K as %s K and %s mK', (kelvin, k, mk) => {
    expect(formatKelvin(kelvin)).toBe(k);
    expect(formatMillikelvin(kelvin)).toBe(mk);
  });
});
