import { formatMeasured, formatSd, sdLastDigit } from '../../src/ui/units/format-measured';

// The rounding rule of format-measured.ts (a common convention, no source): an sd keeps two digits
// when its leading three are 100–354, one digit for 355–949, and 950–999 round up to two digits of
// the next power; the value is rounded to the same decimal place.
describe('value ± sd, rounded consistently', () => {
  it.each([
    [19.902798957883817, 0.04975699739470955, '19.90 ± 0.05'], // u₂ at 1.8 K (498 → one digit)
    [12.3456, 0.0123, '12.346 ± 0.012'], // 123 → two digits
    [12.3456, 0.0354, '12.346 ± 0.035'], // the last two-digit case
    [12.3456, 0.0355, '12.35 ± 0.04'], // the first one-digit case
    [12.3456, 0.0973, '12.35 ± 0.10'], // 973 rounds up to 0.10
    [1234.5, 40, '1230 ± 40'], // an sd in the tens rounds the value to tens
    [-0.0004, 0.01, '0.000 ± 0.010'], // no signed zero
    [-7.0149, 0.0213, '−7.015 ± 0.021'], // a true minus sign
    [0.0115634, 0.0000021, '(1.15634 ± 0.00021) × 10⁻²'], // beyond six decimals: a shared power of ten
    [2.5e7, 3.3e5, '(2.500 ± 0.033) × 10⁷'],
  ])('%f ± %f → %s', (value, sd, text) => {
    expect(formatMeasured(value, sd).text).toBe(text);
  });

  it('without a usable sd shows four significant digits, and never NaN', () => {
    expect(formatMeasured(231.2867, null)).toEqual({ value: '231.3', sd: null, text: '231.3' });
    expect(formatMeasured(231.2867, 0).text).toBe('231.3');
    expect(formatMeasured(231.2867, Number.NaN).text).toBe('231.3');
    expect(formatMeasured(Number.NaN, 0.1).text).toBe('—');
  });

  it('splits value and sd for tables', () => {
    expect(formatMeasured(-48.06, 1.83)).toMatchObject({ value: '−48.1', sd: '1.8' });
    expect(formatSd(0.04975)).toBe('0.05');
    expect(formatSd(0.0123)).toBe('0.012');
    expect(sdLastDigit(0.05)).toBe(-2);
    expect(sdLastDigit(1000)).toBe(2);
    expect(sdLastDigit(-1)).toBeNull();
  });
});
