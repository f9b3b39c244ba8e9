/**
 * The kernel against published measured points: every row of tests/reference/checks/*.csv
 * (Donnelly & Barenghi 1998 adopted data), each with a tolerance that says why it is that wide.
 */
import { describe, expect, it } from 'vitest';
import { CubicBSpline } from '../../src/physics/bspline';
import { density, entropy, secondSound, superfluidFraction } from '../../src/physics';
import { SUPERFLUID_DENSITY_SPLINE } from '../../src/physics/reference-splines';
import { readReferenceCsv } from '../support/reference-csv';

describe('second sound against Donnelly & Barenghi 1998 Table 4.1', () => {
  // Peshkov's points: the published representation scatters around them by up to about 0.25 %
  // (reference README), so 0.3 %; his stated uncertainty (0.75 %) would hide a copying slip.
  const PESHKOV_REL_TOL = 0.003;
  // Wang, Wagner & Donnelly: stated 0.07 %; the spline must sit within that.
  const WANG_REL_TOL = 0.0007;
  const rows = readReferenceCsv('second_sound_speed.csv');

  it('has the rows it should', () => {
    expect(rows.length).toBe(19);
  });

  it.each(rows)('u2($T_K K) ≈ $value m/s, measured by $measuredBy ($table)', (row) => {
    const tol = row.measuredBy.startsWith('Wang') ? WANG_REL_TOL : PESHKOV_REL_TOL;
    expect(Math.abs(secondSound(row.T_K) / row.value - 1)).toBeLessThan(tol);
  });
});

describe('superfluid density against Donnelly & Barenghi 1998 Table 2.1', () => {
  const rows = readReferenceCsv('superfluid_density.csv');
  const rawSpline = new CubicBSpline(SUPERFLUID_DENSITY_SPLINE);
  // Landau-theory rows are printed to four digits (±0.00005 g/cm³); the spline reproduces them to
  // that plus its own smoothing: 1e-4 g/cm³, two units of the last printed digit.
  const LANDAU_ABS_TOL_G_CM3 = 1e-4;
  // Maynard's rows: stated better than 5 %; the representation lies within 1 % of them, so 1.5 %
  // still catches a wrong coefficient.
  const MAYNARD_REL_TOL = 0.015;
  const landauRows = rows.filter((r) => r.measuredBy.startsWith('Landau'));
  const maynardRows = rows.filter((r) => r.measuredBy.startsWith('Maynard'));

  it('has the rows it should', () => {
    expect(landauRows.length + maynardRows.length).toBe(rows.length);
    expect(rows.length).toBe(24);
  });

  it.each(landauRows)('published ρs spline at $T_K K ≈ $value g/cm³ ($measuredBy)', (row) => {
    expect(Math.abs(rawSpline.value(row.T_K) - row.value)).toBeLessThan(LANDAU_ABS_TOL_G_CM3);
  });

  it.each(landauRows.filter((r) => r.T_K >= 0.3))('kernel ρs/ρ·ρ at $T_K K ≈ $value g/cm³ ($measuredBy)', (row) => {
    const rhoS_g_cm3 = (superfluidFraction(row.T_K) * density(row.T_K)) / 1000;
    expect(Math.abs(rhoS_g_cm3 - row.value)).toBeLessThan(LANDAU_ABS_TOL_G_CM3);
  });

  it.each(maynardRows)('kernel ρs at $T_K K ≈ $value g/cm³ ($measuredBy)', (row) => {
    const rhoS_g_cm3 = (superfluidFraction(row.T_K) * density(row.T_K)) / 1000;
    expect(Math.abs(rhoS_g_cm3 / row.value - 1)).toBeLessThan(MAYNARD_REL_TOL);
  });
});

describe('entropy against van den Meijdenberg et al. (Donnelly & Barenghi 1998 Table 8.1)', () => {
  // Stated accuracy of these measurements: 3 %; integrating the adopted heat capacity lands within it.
  const REL_TOL = 0.03;
  const rows = readReferenceCsv('entropy.csv');
  const J_PER_G_TO_J_PER_KG = 1000;

  it('has the rows it should', () => {
    expect(rows.length).toBe(13);
  });

  it.each(rows)('s($T_K K) ≈ $value J/(g·K) ($measuredBy)', (row) => {
    expect(Math.abs(entropy(row.T_K) / (row.value * J_PER_G_TO_J_PER_KG) - 1)).toBeLessThan(REL_TOL);
  });
});

describe('density equations of Donnelly & Barenghi 1998', () => {
  // These four values are the published equation evaluated once when the reference set was made;
  // they confirm a faithful implementation (agreement to the 6 printed digits), not the physics.
  const cases: [number, number, string][] = [
    [1.0, 0.145118, 'D&B 1998 density equation, T < 1.334 K branch'],
    [1.8, 0.145354, 'D&B 1998 density equation, He II branch'],
    [2.0, 0.145622, 'D&B 1998 density equation, He II branch'],
    [2.1, 0.145834, 'D&B 1998 density equation, He II branch'],
  ];
  it.each(cases)('ρ(%f K) = %f g/cm³ (%s)', (T, expected) => {
    expect(Math.abs(density(T) / 1000 - expected)).toBeLessThan(1e-6);
  });

  it('published end values: ρ(0) → 0.1451397 g/cm³ and ρ(Tλ) = 0.1461087 g/cm³ (D&B 1998)', () => {
    expect(density(0.3) / 1000).toBeCloseTo(0.1451397, 5);
    expect(density(2.1768) / 1000).toBeCloseTo(0.1461087, 7);
  });
});
