/**
 * The resonator view's results, derived from its inputs with the kernel (pure functions; the hooks
 * in use-resonator.ts memoise them): the plan, the sweep's fit, the mode number, the candidate
 * temperatures and the choice among them, the temperature B(T) is taken at, the line density,
 * and the lock-in series. Every failure is a message to show, never a thrown error.
 */
import type { LockinCsv, SweepCsv } from '../../io/resonance-csv';
import {
  analyseLockin,
  type Choice,
  type ChoiceRule,
  chooseCandidate,
  fitResonance,
  type LineDensity,
  lineDensityFromAmplitude,
  lineDensityFromWidth,
  type LockinSeries,
  MUTUAL_FRICTION_RANGE_K,
  modeFromNeighbour,
  planResonator,
  type ResonanceFit,
  type ResonanceTemperature,
  type ResonatorPlan,
  coldGap,
  temperatureFromResonance,
  temperatureFromVapourPressure,
} from '../../physics';
import type { ResonatorInputs } from './resonator-slice';

export type Outcome<T> = { ok: true; value: T } | { ok: false; message: string };

function attempt<T>(compute: () => T): Outcome<T> {
  try {
    return { ok: true, value: compute() };
  } catch (error) {
    return { ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}

export function derivePlan(i: ResonatorInputs): Outcome<ResonatorPlan> {
  return attempt(() =>
    planResonator({
      gap_m: i.gap_m,
      gapSd_m: i.gapSd_m,
      spacerId: i.spacerId,
      temperature_K: i.temperature_K,
      modes: i.modes,
      geometry: i.geometry,
      ...(i.plateDiameter_m === null ? {} : { plateDiameter_m: i.plateDiameter_m }),
      ...(i.targetSd_K === null ? {} : { targetSd_K: i.targetSd_K }),
      ...(i.width0_Hz !== null && i.amplitudeNoise !== null ? { width0_Hz: i.width0_Hz, amplitudeNoise: i.amplitudeNoise } : {}),
    }),
  );
}

/** Fits already made, by the parsed file (several hooks ask for the same fit; a large sweep is fitted once). */
const fits = new WeakMap<SweepCsv, Outcome<ResonanceFit>>();

export function deriveFit(data: SweepCsv | null): Outcome<ResonanceFit> | null {
  if (!data) return null;
  let fit = fits.get(data);
  if (!fit) {
    fit = attempt(() => fitResonance(data));
    fits.set(data, fit);
  }
  return fit;
}

/** L from the peak amplitudes (the form) and from the widths (a check), and how far apart they are in sd. */
export interface LineDensityPair {
  amplitude: LineDensity;
  width: LineDensity;
  apartSd: number;
}

export interface SweepReading {
  /** The mode number used (null: none decided) and how it was found. */
  mode: number | null;
  modeReason: string;
  temperature: Outcome<ResonanceTemperature> | null;
  rule: ChoiceRule;
  choice: Choice | null;
  /** The temperature B(T) is taken at and where it came from. */
  bath: { temperature_K: number; from: string };
  lineDensity: Outcome<LineDensityPair> | null;
}

/** The evidence that chooses among candidates: a vapour pressure when typed, else the bath temperature. */
export function evidenceRule(i: ResonatorInputs): ChoiceRule {
  return i.pressure_Pa !== null ? { kind: 'pressure', pressure_Pa: i.pressure_Pa } : { kind: 'near', temperature_K: i.temperature_K };
}

export function deriveReading(i: ResonatorInputs, fit: ResonanceFit, reference: ResonanceFit | null): SweepReading {
  let mode: number | null = i.mode;
  let modeReason = 'the mode number typed';
  if (mode === null) {
    if (i.neighbour_Hz !== null) {
      const nb = i.neighbour_Hz;
      const m = attempt(() => modeFromNeighbour(fit.frequency_Hz, fit.frequencySd_Hz, nb, 0));
      mode = m.ok ? m.value.mode : null;
      modeReason = m.ok ? m.value.reason : m.message;
    } else modeReason = 'no mode number: type n, or the neighbouring resonance';
  }
  const rule = evidenceRule(i);
  let temperature: Outcome<ResonanceTemperature> | null = null;
  let choice: Choice | null = null;
  if (mode !== null) {
    const n = mode;
    temperature = attempt(() => {
      const gap = coldGap(i.gap_m, i.gapSd_m, i.spacerId);
      return temperatureFromResonance({ frequency_Hz: fit.frequency_Hz, frequencySd_Hz: fit.frequencySd_Hz, gap_m: gap.gap_m, gapSd_m: gap.sd_m, mode: n });
    });
    if (temperature.ok && temperature.value.candidates.length > 0) {
      const t = temperature.value;
      const c = attempt(() => chooseCandidate(t.candidates, rule));
      choice = c.ok ? c.value : null;
    }
  }
  const bath = bathForB(i, temperature, choice);
  let lineDensity: SweepReading['lineDensity'] = null;
  if (reference) {
    lineDensity = attempt(() => {
      if (bath.temperature_K < MUTUAL_FRICTION_RANGE_K[0] || bath.temperature_K > MUTUAL_FRICTION_RANGE_K[1]) {
        throw new Error(`No line density at ${bath.temperature_K.toFixed(4)} K (${bath.from}): the published mutual friction B is given from ${MUTUAL_FRICTION_RANGE_K[0].toFixed(4)} K to Tλ.`);
      }
      const amplitude = lineDensityFromAmplitude({
        amplitude: fit.amplitude,
        amplitudeSd: fit.amplitudeSd,
        amplitude0: reference.amplitude,
        amplitude0Sd: reference.amplitudeSd,
        width0_Hz: reference.width_Hz,
        width0Sd_Hz: reference.widthSd_Hz,
        covariance0: reference.covariance[1][2],
        temperature_K: bath.temperature_K,
        geometry: i.geometry,
      });
      const width = lineDensityFromWidth(fit.width_Hz, fit.widthSd_Hz, reference.width_Hz, reference.widthSd_Hz, bath.temperature_K, i.geometry);
      const apartSd = Math.abs(amplitude.lineDensity_m2 - width.lineDensity_m2) / (Math.hypot(amplitude.sd_m2, width.sd_m2) || 1);
      return { amplitude, width, apartSd };
    });
  }
  return { mode, modeReason, temperature, rule, choice, bath, lineDensity };
}

/** B(T) is taken at the vapour-pressure temperature, else the chosen candidate, else the bath temperature typed. */
function bathForB(i: ResonatorInputs, temperature: Outcome<ResonanceTemperature> | null, choice: Choice | null): { temperature_K: number; from: string } {
  if (i.pressure_Pa !== null) {
    const p = attempt(() => temperatureFromVapourPressure(i.pressure_Pa as number));
    if (p.ok) return { temperature_K: p.value.temperature_K, from: 'from the vapour pressure' };
  }
  if (temperature?.ok && choice?.index !== null && choice?.index !== undefined) {
    const c = temperature.value.candidates[choice.index];
    if (c) return { temperature_K: c.temperature_K, from: 'the chosen candidate' };
  }
  return { temperature_K: i.temperature_K, from: 'the bath temperature typed' };
}

export function deriveLockin(i: ResonatorInputs, record: LockinCsv | null, reference: ResonanceFit | null, temperature_K: number): Outcome<LockinSeries> | null {
  if (!record || !reference) return null;
  return attempt(() => analyseLockin(record, reference, { temperature_K, geometry: i.geometry, ...(i.drive_Hz === null ? {} : { drive_Hz: i.drive_Hz }) }));
}
