import type { SampledSignal } from './received-pulse';

/*
 * The Cramér–Rao bound for the delay of a known pulse s(t) in white Gaussian noise of rms σ per
 * sample, sampled every Δt: σ_τ ≥ σ / √(Σᵢ ṡ(tᵢ)²) (Kay, Fundamentals of Statistical Signal
 * Processing: Estimation Theory, 1993, §3.11, range estimation). With samples at a random phase
 * the sum is (1/Δt) ∫ ṡ² dt on average, which is taken here from the planner's finer grid. A
 * matched cross-correlation reaches it at high SNR; the edge pickers (one crossing) do not.
 * Meaningful while the samples resolve the pulse's edges (a few per edge, the planner's
 * 'coarse-sampling' warning says when not).
 */

/**
 * The bound, s, for the pulse `span` (V) with noise rms `noise_V` per sample every
 * `sampleInterval_s`; null when the pulse has no slope.
 */
export function delayBound(span: SampledSignal, noise_V: number, sampleInterval_s: number): number | null {
  const v = span.values;
  const h = span.step_s;
  let integral = 0;
  for (let i = 1; i < v.length; i++) {
    const d = (v[i] as number) - (v[i - 1] as number);
    integral += (d * d) / h;
  }
  const fisher = integral / sampleInterval_s;
  return fisher > 0 ? noise_V / Math.sqrt(fisher) : null;
}
