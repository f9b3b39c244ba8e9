import { ConvergenceError, InvalidInputError, requireInRange } from './errors';
import { initialGuess, medianStep } from './resonance-start';
import { invertSymmetric, solveSymmetric } from './symmetric-solve';

/*
 * A second-sound resonance fitted by least squares (PHYSICS notes §8):
 *   Z(f) = A (Δ/2)/((Δ/2) + i(f − f₀)) e^{iφ} + (b₀ + b₁ (f − f_c)),   b₀, b₁ complex,
 * f₀ the centre, Δ the full width at half power, A the peak amplitude (of |Z − background|), φ the
 * phase at the peak, f_c the middle of the sweep. From an amplitude column alone the magnitude
 *   |Z|(f) = A (Δ/2)/√((Δ/2)² + (f − f₀)²) + c₀ + c₁ (f − f_c)
 * is fitted instead (a real background added to the magnitude: common practice, exact only when
 * the background is small). Levenberg–Marquardt (Marquardt's diagonal scaling), at most
 * {@link FIT_MAX_ITERATIONS} steps; sds from the covariance s² (JᵀJ)⁻¹, s² = residual sum of
 * squares / (2N − 8) (or N − 5): equal, independent noise on X and Y is assumed, its size taken
 * from the residuals. Seeded Monte Carlo checks that the stated sds have pulls of unit width
 * (tests/unit/resonance-fit.test.ts). Correlated residuals (a lock-in time constant longer than
 * the sweep step) make those sds too small: the fit says so.
 */

/** A sweep: frequencies (Hz, monotonic) with in-phase and quadrature signals, or amplitude alone. */
export interface SweepData {
  frequency_Hz: Float64Array;
  x?: Float64Array;
  y?: Float64Array;
  amplitude?: Float64Array;
}

export interface ResonanceWarning {
  code: 'centre-outside' | 'narrow-sweep' | 'coarse-sweep' | 'correlated-residuals' | 'low-signal';
  severity: 'info' | 'caution';
  message: string;
  value: number;
}

export interface ResonanceFit {
  kind: 'complex' | 'amplitude';
  frequency_Hz: number;
  frequencySd_Hz: number;
  /** Full width at half power Δ, Hz. */
  width_Hz: number;
  widthSd_Hz: number;
  /** Peak amplitude A (units of the signal). */
  amplitude: number;
  amplitudeSd: number;
  /** Phase φ at the peak, rad (null for an amplitude fit). */
  phase_rad: number | null;
  phaseSd_rad: number | null;
  /** Quality factor f₀/Δ and its sd. */
  q: number;
  qSd: number;
  /** Background b₀ + b₁ (f − f_c): b₀ at f_c, b₁ per Hz; imaginary parts 0 for an amplitude fit. */
  background: { re: number; im: number; slopeRe_per_Hz: number; slopeIm_per_Hz: number; centre_Hz: number };
  /** Covariance of (f₀, Δ, A) (Hz, Hz, signal units). */
  covariance: [[number, number, number], [number, number, number], [number, number, number]];
  /** Phase covariance with (f₀, Δ, A), or null for an amplitude fit. */
  phaseCovariance: [number, number, number] | null;
  /** Noise per component from the residuals (s), signal units. */
  residualSd: number;
  /** Lag-one correlation of the residuals (0 for white noise). */
  residualCorrelation: number;
  points: number;
  iterations: number;
  warnings: ResonanceWarning[];
}

/** Step cap of the Levenberg–Marquardt loop. */
export const FIT_MAX_ITERATIONS = 200;
/** Stop when a step lowers the residual sum of squares by less than this fraction. */
const RELATIVE_TOLERANCE = 1e-12;
/** Points a sweep needs at least. */
export const SWEEP_MIN_POINTS = 12;
/** Lag-one residual correlation above this draws a caution (common practice, no source). */
const CORRELATION_CAUTION = 0.5;

interface Problem {
  /** Scaled frequency s = (f − f_c)/w. */
  s: Float64Array;
  re: Float64Array;
  im: Float64Array | null;
  n: number;
  complex: boolean;
}

// Parameter order, complex: s0, g, A, φ, b0r, b0i, b1r, b1i; amplitude: s0, g, A, c0, c1.

/**
 * Fits one resonance to a sweep; throws InvalidInputError for unusable data (too few points,
 * non-monotonic or non-finite frequencies, no signal) and ConvergenceError when the fit does not
 * settle within {@link FIT_MAX_ITERATIONS} steps.
 */
export function fitResonance(data: SweepData): ResonanceFit {
  const f = data.frequency_Hz;
  const n = f.length;
  const complex = data.x !== undefined && data.y !== undefined;
  const values = complex ? data.x : data.amplitude;
  if (!values) throw new InvalidInputError('sweep', 'give x and y (in-phase and quadrature) or an amplitude');
  if (n < SWEEP_MIN_POINTS) throw new InvalidInputError('sweep', `a resonance fit needs at least ${SWEEP_MIN_POINTS} points, got ${n}`);
  if (values.length !== n || (complex && (data.y as Float64Array).length !== n)) throw new InvalidInputError('sweep', 'every column needs one value per frequency');
  checkFrequencies(f);
  const fMin = Math.min(f[0] as number, f[n - 1] as number);
  const fMax = Math.max(f[0] as number, f[n - 1] as number);
  const centre = (fMin + fMax) / 2;
  const start = initialGuess(data, complex, centre);
  const scale = start.width_Hz;
  const s = new Float64Array(n);
  for (let i = 0; i < n; i++) s[i] = ((f[i] as number) - centre) / scale;
  const problem: Problem = { s, re: values, im: complex ? (data.y as Float64Array) : null, n, complex };
  const p0 = complex
    ? [start.s0, 0.5, start.A, start.phase, start.b0r, start.b0i, start.b1r * scale, start.b1i * scale]
    : [start.s0, 0.5, start.A, start.b0r, start.b1r * scale];
  const solved = levenbergMarquardt(problem, p0);
  let p = solved.p;
  if ((p[2] as number) < 0) {
    p = p.slice();
    p[2] = -(p[2] as number);
    if (complex) p[3] = (p[3] as number) + Math.PI;
  }
  if (complex) p[3] = wrapPhase(p[3] as number);
  const m = p.length;
  const dof = (complex ? 2 * n : n) - m;
  const s2 = solved.rss / dof;
  const normal = normalMatrix(problem, p).jtj;
  const inverse = invertSymmetric(normal);
  if (!inverse) throw new ConvergenceError('the resonance fit is degenerate: the sweep does not pin down a centre and width (is there a resonance in it?)');
  // Physical scales of the parameters: s0 → f0 (Hz), g → Δ (Hz), the rest as they are (b1 per Hz).
  const unit = complex ? [scale, 2 * scale, 1, 1, 1, 1, 1 / scale, 1 / scale] : [scale, 2 * scale, 1, 1, 1 / scale];
  const cov = (a: number, b: number) => (inverse[a * m + b] as number) * s2 * (unit[a] as number) * (unit[b] as number);
  const f0 = centre + (p[0] as number) * scale;
  const width = 2 * (p[1] as number) * scale;
  const A = p[2] as number;
  const varF = cov(0, 0);
  const varW = cov(1, 1);
  const q = f0 / width;
  const qVar = q * q * (varF / (f0 * f0) + varW / (width * width) - (2 * cov(0, 1)) / (f0 * width));
  const residuals = residualCorrelation(problem, p);
  const fit: ResonanceFit = {
    kind: complex ? 'complex' : 'amplitude',
    frequency_Hz: f0,
    frequencySd_Hz: Math.sqrt(varF),
    width_Hz: width,
    widthSd_Hz: Math.sqrt(varW),
    amplitude: A,
    amplitudeSd: Math.sqrt(cov(2, 2)),
    phase_rad: complex ? (p[3] as number) : null,
    phaseSd_rad: complex ? Math.sqrt(cov(3, 3)) : null,
    q,
    qSd: Math.sqrt(Math.max(0, qVar)),
    background: complex
      ? { re: p[4] as number, im: p[5] as number, slopeRe_per_Hz: (p[6] as number) / scale, slopeIm_per_Hz: (p[7] as number) / scale, centre_Hz: centre }
      : { re: p[3] as number, im: 0, slopeRe_per_Hz: (p[4] as number) / scale, slopeIm_per_Hz: 0, centre_Hz: centre },
    covariance: [
      [cov(0, 0), cov(0, 1), cov(0, 2)],
      [cov(1, 0), cov(1, 1), cov(1, 2)],
      [cov(2, 0), cov(2, 1), cov(2, 2)],
    ],
    phaseCovariance: complex ? [cov(3, 0), cov(3, 1), cov(3, 2)] : null,
    residualSd: Math.sqrt(s2),
    residualCorrelation: residuals,
    points: n,
    iterations: solved.iterations,
    warnings: [],
  };
  fit.warnings = fitWarnings(fit, fMin, fMax, medianStep(f));
  return fit;
}

/** The fitted model at frequency f: complex value (re, im) and its magnitude. */
export function resonanceAt(fit: ResonanceFit, f_Hz: number): { re: number; im: number; magnitude: number } {
  const g = fit.width_Hz / 2;
  const u = f_Hz - fit.frequency_Hz;
  const d2 = g * g + u * u;
  const b = fit.background;
  const off = f_Hz - b.centre_Hz;
  if (fit.kind === 'amplitude') {
    const v = (fit.amplitude * g) / Math.sqrt(d2) + b.re + b.slopeRe_per_Hz * off;
    return { re: v, im: 0, magnitude: Math.abs(v) };
  }
  const phi = fit.phase_rad ?? 0;
  const qr = (g * g) / d2;
  const qi = (-g * u) / d2;
  const er = fit.amplitude * Math.cos(phi);
  const ei = fit.amplitude * Math.sin(phi);
  const re = er * qr - ei * qi + b.re + b.slopeRe_per_Hz * off;
  const im = er * qi + ei * qr + b.im + b.slopeIm_per_Hz * off;
  return { re, im, magnitude: Math.hypot(re, im) };
}

function checkFrequencies(f: Float64Array): void {
  const n = f.length;
  const rising = (f[n - 1] as number) > (f[0] as number);
  for (let i = 0; i < n; i++) {
    const v = f[i] as number;
    requireInRange(`frequency (point ${i + 1})`, v, Number.MIN_VALUE, 1e9, 'Hz');
    if (i > 0) {
      const step = v - (f[i - 1] as number);
      if (rising ? !(step > 0) : !(step < 0)) {
        throw new InvalidInputError('sweep', `frequencies must rise (or fall) steadily; point ${i + 1} (${v} Hz) breaks the order`);
      }
    }
  }
}

/** Residual sum of squares at p, or +∞ when p is outside the model (g ≤ 0). */
function residualSumOfSquares(pr: Problem, p: readonly number[]): number {
  const s0 = p[0] as number;
  const g = p[1] as number;
  if (!(g > 0)) return Number.POSITIVE_INFINITY;
  const A = p[2] as number;
  const { s, re, im, n } = pr;
  let rss = 0;
  if (pr.complex) {
    const er = A * Math.cos(p[3] as number);
    const ei = A * Math.sin(p[3] as number);
    const [b0r, b0i, b1r, b1i] = [p[4] as number, p[5] as number, p[6] as number, p[7] as number];
    const imv = im as Float64Array;
    for (let i = 0; i < n; i++) {
      const si = s[i] as number;
      const u = si - s0;
      const d2 = g * g + u * u;
      const qr = (g * g) / d2;
      const qi = (-g * u) / d2;
      const rr = (re[i] as number) - (er * qr - ei * qi + b0r + b1r * si);
      const ri = (imv[i] as number) - (er * qi + ei * qr + b0i + b1i * si);
      rss += rr * rr + ri * ri;
    }
  } else {
    const [c0, c1] = [p[3] as number, p[4] as number];
    for (let i = 0; i < n; i++) {
      const si = s[i] as number;
      const u = si - s0;
      const r = (re[i] as number) - ((A * g) / Math.sqrt(g * g + u * u) + c0 + c1 * si);
      rss += r * r;
    }
  }
  return rss;
}

/** JᵀJ (row-major m×m) and Jᵀr at p, J the model's derivatives, r = data − model. */
function normalMatrix(pr: Problem, p: readonly number[]): { jtj: Float64Array; jtr: Float64Array } {
  const m = p.length;
  const jtj = new Float64Array(m * m);
  const jtr = new Float64Array(m);
  const s0 = p[0] as number;
  const g = p[1] as number;
  const A = p[2] as number;
  const { s, re, im, n } = pr;
  const jr = new Float64Array(m);
  const ji = new Float64Array(m);
  const add = (row: Float64Array, r: number) => {
    for (let a = 0; a < m; a++) {
      const ra = row[a] as number;
      if (ra === 0) continue;
      jtr[a] = (jtr[a] as number) + ra * r;
      for (let b = a; b < m; b++) jtj[a * m + b] = (jtj[a * m + b] as number) + ra * (row[b] as number);
    }
  };
  if (pr.complex) {
    const cphi = Math.cos(p[3] as number);
    const sphi = Math.sin(p[3] as number);
    const [b0r, b0i, b1r, b1i] = [p[4] as number, p[5] as number, p[6] as number, p[7] as number];
    const imv = im as Float64Array;
    for (let i = 0; i < n; i++) {
      const si = s[i] as number;
      const u = si - s0;
      const d2 = g * g + u * u;
      // Q = g/D = g(g − iu)/|D|²; L = A e^{iφ} Q.
      const qr = (g * g) / d2;
      const qi = (-g * u) / d2;
      const Er = cphi;
      const Ei = sphi;
      const Lr = A * (Er * qr - Ei * qi);
      const Li = A * (Er * qi + Ei * qr);
      // 1/D = (g − iu)/d2
      const invr = g / d2;
      const invi = -u / d2;
      // ∂L/∂s0 = i L / D
      const lr = Lr * invr - Li * invi;
      const li = Lr * invi + Li * invr;
      jr[0] = -li;
      ji[0] = lr;
      // ∂L/∂g = A e^{iφ} (iu)/D² = L · iu/(g D)
      const wr = (-u * invi) / g; // (iu)(invr + i invi)/g = (−u invi + i u invr)/g
      const wi = (u * invr) / g;
      jr[1] = Lr * wr - Li * wi;
      ji[1] = Lr * wi + Li * wr;
      jr[2] = Lr / A;
      ji[2] = Li / A;
      jr[3] = -Li;
      ji[3] = Lr;
      jr[4] = 1;
      ji[4] = 0;
      jr[5] = 0;
      ji[5] = 1;
      jr[6] = si;
      ji[6] = 0;
      jr[7] = 0;
      ji[7] = si;
      add(jr, (re[i] as number) - (Lr + b0r + b1r * si));
      add(ji, (imv[i] as number) - (Li + b0i + b1i * si));
    }
  } else {
    const [c0, c1] = [p[3] as number, p[4] as number];
    for (let i = 0; i < n; i++) {
      const si = s[i] as number;
      const u = si - s0;
      const rho2 = g * g + u * u;
      const rho = Math.sqrt(rho2);
      const rho3 = rho2 * rho;
      jr[0] = (A * g * u) / rho3;
      jr[1] = (A * u * u) / rho3;
      jr[2] = g / rho;
      jr[3] = 1;
      jr[4] = si;
      add(jr, (re[i] as number) - ((A * g) / rho + c0 + c1 * si));
    }
  }
  for (let a = 0; a < m; a++) for (let b = 0; b < a; b++) jtj[a * m + b] = jtj[b * m + a] as number;
  return { jtj, jtr };
}

function levenbergMarquardt(pr: Problem, start: number[]): { p: number[]; rss: number; iterations: number } {
  let p = start.slice();
  let rss = residualSumOfSquares(pr, p);
  if (!Number.isFinite(rss)) throw new ConvergenceError('the resonance fit could not start: the sweep holds non-finite values');
  let lambda = 1e-3;
  const m = p.length;
  for (let iter = 1; iter <= FIT_MAX_ITERATIONS; iter++) {
    const { jtj, jtr } = normalMatrix(pr, p);
    let accepted = false;
    while (lambda < 1e16) {
      const a = jtj.slice();
      for (let k = 0; k < m; k++) a[k * m + k] = (a[k * m + k] as number) * (1 + lambda) + 1e-300;
      const step = solveSymmetric(a, jtr, m);
      if (step) {
        const trial = p.map((v, k) => v + (step[k] as number));
        const trialRss = residualSumOfSquares(pr, trial);
        if (trialRss <= rss) {
          const drop = rss - trialRss;
          p = trial;
          const before = rss;
          rss = trialRss;
          lambda = Math.max(lambda / 10, 1e-12);
          accepted = true;
          if (drop <= RELATIVE_TOLERANCE * before || rss === 0) return { p, rss, iterations: iter };
          break;
        }
      }
      lambda *= 10;
    }
    // No step lowers the sum any more: the minimum is reached to rounding.
    if (!accepted) return { p, rss, iterations: iter };
  }
  throw new ConvergenceError(`the resonance fit did not settle in ${FIT_MAX_ITERATIONS} steps; check that the sweep holds one resonance with its peak inside`);
}

function residualCorrelation(pr: Problem, p: readonly number[]): number {
  // Lag-one autocorrelation of the residuals (both components pooled).
  const residualAt = (i: number): [number, number] => {
    const si = pr.s[i] as number;
    const u = si - (p[0] as number);
    const g = p[1] as number;
    const A = p[2] as number;
    if (!pr.complex) return [(pr.re[i] as number) - ((A * g) / Math.sqrt(g * g + u * u) + (p[3] as number) + (p[4] as number) * si), 0];
    const d2 = g * g + u * u;
    const qr = (g * g) / d2;
    const qi = (-g * u) / d2;
    const er = A * Math.cos(p[3] as number);
    const ei = A * Math.sin(p[3] as number);
    return [
      (pr.re[i] as number) - (er * qr - ei * qi + (p[4] as number) + (p[6] as number) * si),
      ((pr.im as Float64Array)[i] as number) - (er * qi + ei * qr + (p[5] as number) + (p[7] as number) * si),
    ];
  };
  let num = 0;
  let den = 0;
  let prev = residualAt(0);
  den += prev[0] * prev[0] + prev[1] * prev[1];
  for (let i = 1; i < pr.n; i++) {
    const cur = residualAt(i);
    num += cur[0] * prev[0] + cur[1] * prev[1];
    den += cur[0] * cur[0] + cur[1] * cur[1];
    prev = cur;
  }
  return den > 0 ? num / den : 0;
}

function fitWarnings(fit: ResonanceFit, fMin: number, fMax: number, step: number): ResonanceWarning[] {
  const out: ResonanceWarning[] = [];
  const f0 = fit.frequency_Hz;
  if (f0 < fMin || f0 > fMax) {
    out.push({ code: 'centre-outside', severity: 'caution', message: `The fitted centre ${f0.toPrecision(7)} Hz lies outside the sweep (${fMin}–${fMax} Hz): sweep across the peak.`, value: f0 });
  }
  const span = fMax - fMin;
  if (span < 2 * fit.width_Hz) {
    out.push({ code: 'narrow-sweep', severity: 'caution', message: `The sweep spans ${(span / fit.width_Hz).toFixed(2)} widths (under 2): width and background are hard to tell apart; sweep wider.`, value: span / fit.width_Hz });
  }
  if (fit.width_Hz < 3 * step) {
    out.push({ code: 'coarse-sweep', severity: 'caution', message: `Only ${(fit.width_Hz / step).toFixed(1)} frequency steps across the width (under 3): sweep with finer steps.`, value: fit.width_Hz / step });
  }
  if (fit.residualCorrelation > CORRELATION_CAUTION) {
    out.push({
      code: 'correlated-residuals',
      severity: 'caution',
      message: `Neighbouring residuals are correlated (lag-one r = ${fit.residualCorrelation.toFixed(2)}): the stated sds assume independent points and are too small; a lock-in time constant longer than the step, or a shape the model lacks.`,
      value: fit.residualCorrelation,
    });
  }
  if (fit.amplitude < 3 * fit.residualSd) {
    out.push({ code: 'low-signal', severity: 'caution', message: `The peak (${fit.amplitude.toPrecision(3)}) is under 3 noise sds (${fit.residualSd.toPrecision(3)}): the fit may be following noise.`, value: fit.amplitude / fit.residualSd });
  }
  return out;
}

function wrapPhase(phi: number): number {
  let v = phi % (2 * Math.PI);
  if (v > Math.PI) v -= 2 * Math.PI;
  if (v <= -Math.PI) v += 2 * Math.PI;
  return v;
}
