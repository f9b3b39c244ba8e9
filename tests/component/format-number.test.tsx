import { formatFixed, formatScientific, formatSignificant } from '../../src/ui/units/format-number';

describe('number formatting', () => {
  it.each([
    [19.902798957883817, '19.90'],
    [231.28672743920714, '231.3'],
    [0.6867112705478066, '0.6867'],
    [1638.218694927497, '1638'],
    [-7.0149795469418414, '−7.015'],
    [0, '0'],
    [0.9999968593065088, '1.000'],
    [99.99996, '100.0'],
    [24046.355895378507, '24046'],
    [0.00123456, '0.001235'],
    [3.140693491192418e-6, '3.141 × 10⁻⁶'],
    [2.5e7, '2.500 × 10⁷'],
    [Number.NaN, '—'],
    [Number.POSITIVE_INFINITY, '—'],
  ])('shows %f as %s', (x, shown) => {
    expect(formatSignificant(x)).toBe(shown);
  });

  it('formats fixed decimals and scientific notation with a true minus sign', () => {
    expect(formatFixed(-1.23456, 2)).toBe('−1.23');
    expect(formatScientific(-1.5e-12, 2)).toBe('−1.5 × 10⁻¹²');
  });
});
