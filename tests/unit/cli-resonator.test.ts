/**
 * The resonator commands (resonator, sweep, lockin) in-process: the JSON fields the issue fixes,
 * the demo's known truth (tests/support/resonator-demo.ts), CSV output and one-line refusals.
 */
import { describe, expect, it } from 'vitest';
import { secondSound } from '../../src/physics';
import { expectJsonUsageError, expectUsageError, run, runJson } from '../support/cli-harness';
import { DEMO_LOCKIN_PATH, DEMO_REFERENCE_PATH, DEMO_SWEEP_PATH, demoLineDensity, demoTruth } from '../support/resonator-demo';

describe('sekundo resonator', () => {
  it('gives modes: [{n, frequency_Hz, dfdT_Hz_K}] with f_n = n u₂/(2d)', async () => {
    const r = await runJson<{ modes: { n: number; frequency_Hz: number; dfdT_Hz_K: number }[] }>('resonator', '--gap', '2mm', '--temperature', '1.65K', '--modes', '20');
    expect(r.modes).toHaveLength(20);
    expect(Object.keys(r.modes[0] ?? {})).toEqual(expect.arrayContaining(['n', 'frequency_Hz', 'dfdT_Hz_K']));
    expect(r.modes[4]?.frequency_Hz).toBeCloseTo((5 * secondSound(1.65)) / 4e-3, 6);
    // 1.65 K is within 1 mK of the u₂ maximum: df/dT is small there (Wang, Wagner & Donnelly 1987).
    expect(Math.abs(r.modes[0]?.dfdT_Hz_K ?? 1)).toBeLessThan(10);
  });
  it('prints a table without --json', async () => {
    const r = await run('resonator', '--gap', '10mm', '--spacer', 'stainless-304', '--temperature', '1.85K', '--plate-diameter', '25mm', '--target-sd', '10uK');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/Mode spacing/);
    expect(r.stdout).toMatch(/Fresnel/);
  });
  it.each([
    [['resonator', '--temperature', '1.8K'], /needs --gap/],
    [['resonator', '--gap', '2mm'], /needs --temperature/],
    [['resonator', '--gap', '2mm', '--temperature', '2.5K'], /--temperature .*not below Tλ/],
    [['resonator', '--gap', '-1mm', '--temperature', '1.8K'], /--gap .* outside the valid range/],
    [['resonator', '--gap', '2mm', '--temperature', '1.8K', '--spacer', 'wood'], /--spacer "wood" is not a known material/],
    [['resonator', '--gap', '2mm', '--temperature', '1.8K', '--width0', '2Hz'], /--noise is needed with --width0/],
    [['resonator', '--gap', '2mm', '--temperature', '1.8K', '--modes', '0'], /--modes 0 is outside/],
  ])('refuses %j in one line', async (argv, message) => {
    expect(expectUsageError(await run(...argv))).toMatch(message);
  });
});

interface SweepOut {
  resonance: { frequency_Hz: number; frequencySd_Hz: number; width_Hz: number; widthSd_Hz: number; amplitude: number; amplitudeSd: number; q: number };
  candidates: { temperature_K: number }[];
  chosen: number | null;
  lineDensity_m2: number | null;
  lineDensitySd_m2: number | null;
  lineDensityFromWidth_m2: number | null;
  warnings: { code: string }[];
}

describe('sekundo sweep on the invented Kestrel-2 demo (its truth: L = 3e8 m⁻², 1.85005 K)', () => {
  const base = ['sweep', DEMO_SWEEP_PATH, '--gap', '10mm', '--spacer', 'stainless-304', '--mode', '8', '--reference', DEMO_REFERENCE_PATH];

  it('gives resonance {frequency_Hz, frequencySd_Hz, width_Hz, widthSd_Hz, amplitude, amplitudeSd, q}, candidates, lineDensity_m2, lineDensitySd_m2', async () => {
    const r = await runJson<SweepOut>(...base, '--temperature', '1.85K');
    expect(Object.keys(r.resonance)).toEqual(expect.arrayContaining(['frequency_Hz', 'frequencySd_Hz', 'width_Hz', 'widthSd_Hz', 'amplitude', 'amplitudeSd', 'q']));
    expect(r.candidates.length).toBe(3);
    expect(r.chosen).toBe(2);
    expect(Math.abs((r.candidates[2]?.temperature_K ?? 0) - 1.85005)).toBeLessThan(0.005);
    // The demo's L is 3e8 m⁻²; the stated sd must cover it (4 sd).
    expect(Math.abs((r.lineDensity_m2 ?? 0) - 3e8)).toBeLessThan(4 * (r.lineDensitySd_m2 ?? 0));
    expect(Math.abs((r.lineDensityFromWidth_m2 ?? 0) - 3e8)).toBeLessThan(0.05 * 3e8);
    expect(r.warnings.map((w) => w.code)).not.toContain('forms-disagree');
  });

  it('takes B at the vapour-pressure temperature, against a typed reference (Δ₀, A₀)', async () => {
    const t = demoTruth();
    const r = await runJson<SweepOut & { temperatureFrom: string }>('sweep', DEMO_SWEEP_PATH, '--width0', `${t.width_Hz}Hz`, '--amplitude0', `${t.amplitude * 1e3}mV`, '--pressure', '2.27kPa');
    expect(r.temperatureFrom).toBe('pressure');
    expect(Math.abs((r.lineDensity_m2 ?? 0) - 3e8)).toBeLessThan(0.05 * 3e8);
  });

  it('finds the mode from a neighbouring resonance', async () => {
    const t = demoTruth();
    const r = await runJson<{ mode: number | null }>('sweep', DEMO_SWEEP_PATH, '--gap', '10mm', '--spacer', 'stainless-304', '--neighbour', `${(t.f0_Hz * 9) / 8}Hz`);
    expect(r.mode).toBe(8);
  });

  it.each([
    [['sweep'], /needs a sweep CSV/],
    [['sweep', 'no-such-file.csv'], /sweep file "no-such-file.csv"/],
    [['sweep', DEMO_SWEEP_PATH, '--mode', '8'], /--mode needs --gap/],
    [['sweep', DEMO_SWEEP_PATH, '--reference', DEMO_REFERENCE_PATH], /needs the bath temperature for B\(T\)/],
    [['sweep', DEMO_SWEEP_PATH, '--reference', DEMO_REFERENCE_PATH, '--temperature', '1.1K'], /outside 1\.28.*mutual friction B/],
    [['sweep', DEMO_SWEEP_PATH, '--width0', '2Hz'], /--amplitude0 is needed too/],
    [['sweep', DEMO_SWEEP_PATH, '--temperature', '1.8K', '--pressure', '2kPa'], /not both/],
    [['sweep', DEMO_SWEEP_PATH, '--geometry', 'cubic'], /--geometry "cubic" is not known/],
    [['sweep', DEMO_LOCKIN_PATH], /no column "frequency_Hz"/],
  ])('refuses %j in one line', async (argv, message) => {
    expect(expectUsageError(await run(...argv))).toMatch(message);
  });

  it('refuses as one JSON object with --json', async () => {
    const e = expectJsonUsageError(await run('sweep', 'no-such-file.csv', '--json'));
    expect(e.field).toBe('sweep file');
  });
});

describe('sekundo lockin on the demo record', () => {
  const args = ['lockin', DEMO_LOCKIN_PATH, '--reference', DEMO_REFERENCE_PATH, '--temperature', '1.85K'];
  it('gives rows: [{time_s, lineDensity_m2, lineDensitySd_m2, frequencyShift_Hz, frequencyShiftSd_Hz}] that cover the demo’s L(t)', async () => {
    const r = await runJson<{ rows: { time_s: number; lineDensity_m2: number; lineDensitySd_m2: number; frequencyShift_Hz: number; frequencyShiftSd_Hz: number }[] }>(...args);
    expect(r.rows).toHaveLength(2400);
    expect(Object.keys(r.rows[0] ?? {})).toEqual(expect.arrayContaining(['time_s', 'lineDensity_m2', 'lineDensitySd_m2', 'frequencyShift_Hz', 'frequencyShiftSd_Hz']));
    const pulls = r.rows.map((row) => (row.lineDensity_m2 - demoLineDensity(row.time_s)) / row.lineDensitySd_m2);
    const inside = pulls.filter((p) => Math.abs(p) < 2).length / pulls.length;
    // Rows share one reference, so the pulls are correlated: about 95 % inside 2 sd, not exactly; 85 % at least.
    expect(inside).toBeGreaterThan(0.85);
    const last = r.rows[r.rows.length - 1];
    expect(Math.abs((last?.frequencyShift_Hz ?? 0) + (0.3 * (last?.time_s ?? 0)) / 120)).toBeLessThan(4 * (last?.frequencyShiftSd_Hz ?? 0));
  });
  it('writes CSV without --json', async () => {
    const r = await run(...args);
    expect(r.status).toBe(0);
    const lines = r.stdout.trimEnd().split('\n');
    expect(lines[0]).toBe('time_s,lineDensity_m2,lineDensitySd_m2,frequencyShift_Hz,frequencyShiftSd_Hz,temperatureShift_K,temperatureShiftSd_K');
    expect(lines).toHaveLength(2401);
  });
  it('uses the factor 6π/(Bκ) per hertz of extra width (isotropic) and 4π with --geometry perpendicular', async () => {
    const iso = await runJson<{ rows: { lineDensity_m2: number }[] }>(...args);
    const perp = await runJson<{ rows: { lineDensity_m2: number }[] }>(...args, '--geometry', 'perpendicular');
    expect((perp.rows[1000]?.lineDensity_m2 ?? 0) / (iso.rows[1000]?.lineDensity_m2 ?? 1)).toBeCloseTo(4 / 6, 12);
  });
  it.each([
    [['lockin', DEMO_LOCKIN_PATH], /needs --reference/],
    [['lockin', DEMO_LOCKIN_PATH, '--reference', DEMO_REFERENCE_PATH], /needs the bath temperature/],
    [['lockin', DEMO_SWEEP_PATH, '--reference', DEMO_REFERENCE_PATH, '--temperature', '1.85K'], /lock-in file .*no column "time_s"/],
  ])('refuses %j in one line', async (argv, message) => {
    expect(expectUsageError(await run(...argv))).toMatch(message);
  });
});
