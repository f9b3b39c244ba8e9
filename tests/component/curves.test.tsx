import { heliumProperties } from '../../src/physics';
import {
  INSENSITIVE_SLOPE_M_S_K,
  insensitiveIntervals,
  propertyCurves,
  secondSoundExtremes,
} from '../../src/ui/charts/curves';

// Published: u2 minimum ≈ 18.3 m/s near 1.12 K, maximum ≈ 20.36 m/s near 1.65 K (Donnelly & Barenghi
// 1998, Table 4.1). The sweep's 2.5 mK grid and the published rounding allow 0.01 K and 0.05 m/s.
const EXTREMES: [kind: 'minimum' | 'maximum', T_K: number, u2_m_s: number, source: string][] = [
  ['minimum', 1.12, 18.3, 'Donnelly & Barenghi 1998, Table 4.1'],
  ['maximum', 1.65, 20.36, 'Donnelly & Barenghi 1998, Table 4.1; Wang, Wagner & Donnelly 1987'],
];
const EXTREME_T_TOLERANCE_K = 0.01;
const EXTREME_U2_TOLERANCE_M_S = 0.05;

describe('property curves', () => {
  it('cover the kernel range with u2 where He II exists and never NaN', () => {
    const curves = propertyCurves();
    expect(curves.temperature_K[0]).toBe(0.3);
    expect(curves.temperature_K.at(-1)).toBe(4.24);
    for (const list of [curves.firstSound_m_s, curves.superfluidFraction, curves.normalFraction]) {
      expect(list.every(Number.isFinite)).toBe(true);
    }
    expect(curves.secondSound_m_s.every((u) => u === null || Number.isFinite(u))).toBe(true);
  });

  it('is computed once', () => {
    expect(propertyCurves()).toBe(propertyCurves());
  });

  it.each(EXTREMES)('finds the u2 %s near %f K (%s)', (kind, T_K, u2_m_s) => {
    const found = secondSoundExtremes(propertyCurves()).find((extreme) => extreme.kind === kind);
    expect(Math.abs((found?.temperature_K ?? 0) - T_K)).toBeLessThan(EXTREME_T_TOLERANCE_K);
    expect(Math.abs((found?.secondSound_m_s ?? 0) - u2_m_s)).toBeLessThan(EXTREME_U2_TOLERANCE_M_S);
  });

  it('places insensitive intervals where |du2/dT| is below the threshold, ends on the threshold', () => {
    const curves = propertyCurves();
    const intervals = insensitiveIntervals(curves.temperature_K, curves.secondSoundSlope_m_s_K, INSENSITIVE_SLOPE_M_S_K);
    expect(intervals).toHaveLength(2);
    for (const { from_K, to_K } of intervals) {
      const mid = heliumProperties((from_K + to_K) / 2).secondSoundSlope_m_s_K ?? Number.NaN;
      expect(Math.abs(mid)).toBeLessThan(INSENSITIVE_SLOPE_M_S_K);
      for (const end of [from_K, to_K]) {
        const slope = heliumProperties(end).secondSoundSlope_m_s_K ?? Number.NaN;
        // Linear interpolation between samples 2.5 mK apart: the slope there is within 0.1 m/s/K.
        expect(Math.abs(Math.abs(slope) - INSENSITIVE_SLOPE_M_S_K)).toBeLessThan(0.1);
      }
    }
  });

  it('handles intervals that touch the ends of the samples and null samples', () => {
    expect(insensitiveIntervals([1, 2, 3, 4], [0, 0, 5, 0], 1)).toEqual([
      { from_K: 1, to_K: 2.2 },
      { from_K: 3.8, to_K: 4 },
    ]);
    expect(insensitiveIntervals([1, 2, 3], [0, null, 0], 1)).toEqual([
      { from_K: 1, to_K: 1 },
      { from_K: 3, to_K: 3 },
    ]);
    expect(insensitiveIntervals([], [], 1)).toEqual([]);
  });
});
