import {
  checkTemperature,
  formatKelvin,
  formatMillikelvin,
  parseTemperature,
  TEMPERATURE_RANGE_TEXT,
} from '../../src/ui/units/temperature-text';

// Exact conversions: no tolerance beyond floating-point rounding.
const ACCEPTED: [typed: string, kelvin: number][] = [
  ['1.8', 1.8],
  ['1.8 K', 1.8],
  ['1.8K', 1.8],
  ['1.8 k', 1.8],
  ['1800 mK', 1.8],
  ['1800mk', 1.8],
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
  ['abc', /must be a number in K or mK/],
  ['1.8 C', /must be a number in K or mK/],
  ['1.8 K K', /must be a number in K or mK/],
  ['5 K', /must be 0\.3–4\.24 K \(300–4240 mK\); got 5 K/],
  ['0.29999', /must be 0\.3–4\.24 K/],
  ['4.2401', /must be 0\.3–4\.24 K/],
  ['299 mK', /got 299 mK/],
  ['-1 K', /must be 0\.3–4\.24 K/],
  ['\u22121 K', /must be 0\.3–4\.24 K/],
  ['1e999', /must be 0\.3–4\.24 K/],
  ['2000', /did you mean 2000 mK\?/],
];

describe('typed temperatures', () => {
  it('states the range in both units', () => {
    expect(TEMPERATURE_RANGE_TEXT).toBe('0.3–4.24 K (300–4240 mK)');
  });

  it.each(ACCEPTED)('reads %j as %f K', (typed, kelvin) => {
    const parsed = parseTemperature(typed);
    expect(parsed.ok).toBe(true);
    if (parsed.ok) expect(parsed.temperature_K).toBeCloseTo(kelvin, 12);
  });

  it.each(REJECTED)('rejects %j', (typed, why) => {
    const parsed = parseTemperature(typed);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) {
      expect(parsed.message).toMatch(why);
      expect(parsed.message).toMatch(/^Temperature/);
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
