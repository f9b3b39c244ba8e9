/**
 * `sekundo sweep FILE.csv`: a frequency sweep across one resonance → the fitted centre, width,
 * amplitude and Q with sds (complex Lorentzian with a complex linear background); with the gap and
 * the mode number (or a neighbouring resonance) every candidate bath temperature, as `delay`
 * gives them; against a vortex-free reference (a second sweep, or typed Δ₀ and A₀) the vortex
 * line density L = (6π Δ₀/(B κ))(A₀/A − 1) with its sds.
 */
import {
  type LineDensity,
  lineDensityFromAmplitude,
  lineDensityFromWidth,
  lineDensityGeometry,
  modeFromNeighbour,
  RESONANCE_LIMITS,
  type ResonanceFit,
  type ResonanceTemperature,
  type TangleGeometry,
  temperatureFromResonance,
} from '../../physics';
import type { OperandSpec, QuantityFlag } from '../args';
import type { Command } from '../command';
import { EXIT_OK, UsageError } from '../errors';
import { alignTable, formatSignificant } from '../format';
import { kernelCall } from '../kernel-call';
import { type ChoiceResult, chooseFor, INTERVAL_LEGEND, PRESSURE_SD_FLAG, renderCandidates, renderWarnings } from './convert-shared';
import {
  GAP_FLAG,
  GAP_SD_FLAG,
  GEOMETRY_FLAG,
  MODE_FLAG,
  optionalInRange,
  PRESSURE_FLAG,
  readAndFit,
  readBath,
  readGap,
  readGeometry,
  REFERENCE_FLAG,
  requireMutualFrictionRange,
  type ResonanceJson,
  resonanceJson,
  SPACER_FLAG,
  TEMPERATURE_FLAG,
} from './resonator-shared';
import { JSON_FLAG, writeJson } from './shared';

const FILE_OPERAND: OperandSpec = { name: 'file', placeholder: 'FILE', help: 'a sweep CSV: frequency_Hz and x, y (or amplitude)' };


const NEIGHBOUR_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'neighbour',
  dimension: 'frequency',
  placeholder: 'f',
  range: RESONANCE_LIMITS.frequency_Hz,
  help: 'centre of the neighbouring resonance (mode n ± 1): the spacing gives n (instead of --mode)',
};

const NEIGHBOUR_SD_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'neighbour-sd',
  dimension: 'frequency',
  placeholder: 'σf',
  range: RESONANCE_LIMITS.frequencySd_Hz,
  help: 'one-sigma of --neighbour (default 0)',
};


const WIDTH0_FLAG: QuantityFlag = { kind: 'quantity', name: 'width0', dimension: 'frequency', placeholder: 'Δ₀', range: [1e-6, 1e6], help: 'vortex-free full width, instead of --reference (with --amplitude0)' };
const WIDTH0_SD_FLAG: QuantityFlag = { kind: 'quantity', name: 'width0-sd', dimension: 'frequency', placeholder: 'σΔ₀', range: [0, 1e6], help: 'one-sigma of --width0 (default 0)' };
const AMPLITUDE0_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'amplitude0',
  dimension: 'voltage',
  placeholder: 'A₀',
  range: [1e-15, 1e6],
  help: 'vortex-free peak amplitude, in the sweep\'s signal unit (volts when its columns name a unit, x_mV …; else the file\'s numbers)',
};
const AMPLITUDE0_SD_FLAG: QuantityFlag = { kind: 'quantity', name: 'amplitude0-sd', dimension: 'voltage', placeholder: 'σA₀', range: [0, 1e6], help: 'one-sigma of --amplitude0 (default 0)' };

/** The JSON printed by `sweep`. */
export interface SweepJson extends ChoiceResult {
  file: string;
  resonance: ResonanceJson;
  reference: { file: string | null; resonance: ResonanceJson | null; width0_Hz: number; width0Sd_Hz: number; amplitude0: number; amplitude0Sd: number } | null;
  gap_m: number | null;
  gapCold_m: number | null;
  gapColdSd_m: number | null;
  mode: number | null;
  modeReason: string;
  speed_m_s: number | null;
  speedSd_m_s: number | null;
  temperature_K: number | null;
  temperatureFrom: 'temperature' | 'pressure' | 'chosen candidate' | null;
  lineDensity_m2: number | null;
  lineDensitySd_m2: number | null;
  lineDensitySdMeasurement_m2: number | null;
  lineDensitySdReference_m2: number | null;
  lineDensityFromWidth_m2: number | null;
  lineDensityFromWidthSd_m2: number | null;
  mutualFrictionB: number | null;
  geometry: TangleGeometry;
  geometrySource: string;
}

export const sweepCommand: Command = {
  name: 'sweep',
  summary: 'a resonance sweep (CSV) → f₀, width, Q with sds; temperature candidates; vortex line density',
  synopsis: [
    'sweep FILE [--gap <d> [--spacer <M>] (--mode <n> | --neighbour <f>)] [--reference <REF> | --width0 <Δ₀> --amplitude0 <A₀>] [--temperature <T> | --pressure <p>] [--geometry <G>] [--json]',
  ],
  description:
    'Fits the resonance in a sweep CSV (columns frequency_Hz and x, y — also X/Y, in_phase/quadrature — or amplitude; ' +
    'a unit in a column name scales it) by least squares: a complex Lorentzian (centre f₀, full width Δ, peak amplitude ' +
    'A, phase) on a complex linear background, or from an amplitude alone its magnitude on a real background. sds come ' +
    'from the fit\'s covariance scaled by the residuals (equal, independent noise on x and y assumed). ' +
    'With --gap and --mode (or --neighbour, the centre of the next resonance, whose spacing gives n) the speed ' +
    'u₂ = 2 d f₀/n gives every candidate temperature with its sds and intervals, as "sekundo delay"; --temperature or ' +
    '--pressure chooses one. Against a vortex-free reference (--reference REF.csv, fitted the same way, or --width0 and ' +
    '--amplitude0) the line density L = (6π Δ₀/(B κ))(A₀/A − 1) of an isotropic tangle (--geometry for the others), ' +
    'with B(T) from Donnelly & Barenghi (1998) at the bath temperature (--temperature, --pressure, or the chosen ' +
    'candidate) and κ = h/m₄; its sd in two parts (this sweep\'s, the reference\'s). The width form 6π(Δ − Δ₀)/(B κ) ' +
    'is given beside it as a check. With --json prints {resonance: {frequency_Hz, frequencySd_Hz, width_Hz, widthSd_Hz, ' +
    'amplitude, amplitudeSd, q, …}, candidates (as delay), chosen, choice, warnings, lineDensity_m2, lineDensitySd_m2, …}.',
  flags: [
    GAP_FLAG,
    GAP_SD_FLAG,
    SPACER_FLAG,
    MODE_FLAG,
    NEIGHBOUR_FLAG,
    NEIGHBOUR_SD_FLAG,
    REFERENCE_FLAG,
    WIDTH0_FLAG,
    WIDTH0_SD_FLAG,
    AMPLITUDE0_FLAG,
    AMPLITUDE0_SD_FLAG,
    TEMPERATURE_FLAG,
    PRESSURE_FLAG,
    PRESSURE_SD_FLAG,
    GEOMETRY_FLAG,
    JSON_FLAG,
  ],
  operands: [FILE_OPERAND],
  examples: [
    'sweep public/demo-resonator-sweep.csv --gap 10mm --spacer stainless-304 --mode 8 --reference public/demo-resonator-reference.csv --json',
    'sweep sweep.csv --width0 2.4Hz --amplitude0 2mV --temperature 1.85K',
    'sweep sweep.csv --gap 10mm --neighbour 6.834kHz --pressure 2.2kPa',
  ],
  run(args, io) {
    const path = args.operand(FILE_OPERAND.name);
    if (path === undefined) throw new UsageError('"sekundo sweep" needs a sweep CSV (frequency_Hz and x, y or amplitude), e.g. sekundo sweep sweep.csv');
    const gap = readGap(args);
    const geometry = readGeometry(args);
    const bath = readBath('sweep', args);
    if (args.has(PRESSURE_SD_FLAG.name) && bath?.from !== 'pressure') throw new UsageError(`--${PRESSURE_SD_FLAG.name} needs --pressure: it is the gauge's sd`);
    const pressureSd = optionalInRange(args, PRESSURE_SD_FLAG);
    const modeArg = args.number(MODE_FLAG.name);
    const neighbour = optionalInRange(args, NEIGHBOUR_FLAG);
    const neighbourSd = optionalInRange(args, NEIGHBOUR_SD_FLAG) ?? 0;
    if (modeArg && neighbour !== undefined) throw new UsageError('give --mode or --neighbour, not both');
    if (args.has(NEIGHBOUR_SD_FLAG.name) && neighbour === undefined) throw new UsageError('--neighbour-sd needs --neighbour');
    if ((modeArg || neighbour !== undefined) && !gap) throw new UsageError(`--${modeArg ? 'mode' : 'neighbour'} needs --gap: the speed is 2 d f₀/n`);
    const typedReference = readTypedReference(args);
    const referencePath = args.text(REFERENCE_FLAG.name);
    if (referencePath !== undefined && typedReference) throw new UsageError('give --reference or --width0 and --amplitude0, not both');

    const { fit } = readAndFit(path, 'sweep file');
    const reference = referencePath === undefined ? null : readAndFit(referencePath, 'reference file').fit;

    let mode: number | null = null;
    let modeReason = 'no mode number: give --gap with --mode or --neighbour for temperatures';
    if (modeArg) {
      mode = modeArg.value;
      modeReason = 'from --mode';
    } else if (neighbour !== undefined) {
      const m = kernelCall(() => modeFromNeighbour(fit.frequency_Hz, fit.frequencySd_Hz, neighbour, neighbourSd));
      mode = m.mode;
      modeReason = m.reason;
    }
    let conversion: ResonanceTemperature | null = null;
    if (gap && mode !== null) {
      const m = mode;
      conversion = kernelCall(() => temperatureFromResonance({ frequency_Hz: fit.frequency_Hz, frequencySd_Hz: fit.frequencySd_Hz, gap_m: gap.gap_m, gapSd_m: gap.sd_m, mode: m }));
    }
    const rule =
      bath?.from === 'pressure'
        ? { rule: { kind: 'pressure' as const, pressure_Pa: bath.pressure_Pa as number, ...(pressureSd === undefined ? {} : { pressureSd_Pa: pressureSd }) } }
        : bath
          ? { rule: { kind: 'near' as const, temperature_K: bath.temperature_K } }
          : undefined;
    const choice: ChoiceResult = conversion
      ? chooseFor(conversion.candidates, rule, conversion)
      : { chosen: null, choice: modeReason, candidates: [], warnings: [] };
    const chosen = choice.chosen === null ? null : (choice.candidates[choice.chosen] ?? null);
    const temperature_K = bath?.temperature_K ?? chosen?.temperature_K ?? null;
    const temperatureFrom: SweepJson['temperatureFrom'] = bath ? bath.from : chosen ? 'chosen candidate' : null;

    const ref = reference ? fromFit(reference) : typedReference;
    let lineDensity: LineDensity | null = null;
    let widthForm: LineDensity | null = null;
    if (ref) {
      if (temperature_K === null) {
        throw new UsageError('a line density needs the bath temperature for B(T): give --temperature or --pressure, or --gap and --mode so that the resonance gives a chosen temperature');
      }
      requireMutualFrictionRange(temperature_K, temperatureFrom === 'chosen candidate' ? 'the chosen temperature' : 'the bath temperature');
      lineDensity = kernelCall(() =>
        lineDensityFromAmplitude({
          amplitude: fit.amplitude,
          amplitudeSd: fit.amplitudeSd,
          amplitude0: ref.amplitude0,
          amplitude0Sd: ref.amplitude0Sd,
          width0_Hz: ref.width0_Hz,
          width0Sd_Hz: ref.width0Sd_Hz,
          covariance0: ref.covariance0,
          temperature_K,
          geometry,
        }),
      );
      widthForm = kernelCall(() => lineDensityFromWidth(fit.width_Hz, fit.widthSd_Hz, ref.width0_Hz, ref.width0Sd_Hz, temperature_K, geometry));
      const gapSd = Math.hypot(lineDensity.sd_m2, widthForm.sd_m2);
      const apart = Math.abs(lineDensity.lineDensity_m2 - widthForm.lineDensity_m2) / (gapSd || 1);
      if (apart > 3) {
        choice.warnings.push({
          code: 'forms-disagree',
          severity: 'caution',
          message: `The amplitude form (A₀/A) and the width form (Δ − Δ₀) of L differ by ${apart.toFixed(1)} sd: the drive or the gain changed between the sweeps, or the reference is not vortex-free; trust the width form when the drive changed.`,
          value: apart,
          limit: 3,
        });
      }
    }
    const info = lineDensityGeometry(geometry);
    const result: SweepJson = {
      file: path,
      resonance: resonanceJson(fit),
      reference: ref ? { file: referencePath ?? null, resonance: reference ? resonanceJson(reference) : null, width0_Hz: ref.width0_Hz, width0Sd_Hz: ref.width0Sd_Hz, amplitude0: ref.amplitude0, amplitude0Sd: ref.amplitude0Sd } : null,
      gap_m: gap?.gapAsGiven_m ?? null,
      gapCold_m: gap?.gap_m ?? null,
      gapColdSd_m: gap?.sd_m ?? null,
      mode,
      modeReason,
      speed_m_s: conversion?.speed_m_s ?? null,
      speedSd_m_s: conversion?.speedSd_m_s ?? null,
      ...choice,
      temperature_K,
      temperatureFrom,
      lineDensity_m2: lineDensity?.lineDensity_m2 ?? null,
      lineDensitySd_m2: lineDensity?.sd_m2 ?? null,
      lineDensitySdMeasurement_m2: lineDensity?.sdMeasurement_m2 ?? null,
      lineDensitySdReference_m2: lineDensity?.sdReference_m2 ?? null,
      lineDensityFromWidth_m2: widthForm?.lineDensity_m2 ?? null,
      lineDensityFromWidthSd_m2: widthForm?.sd_m2 ?? null,
      mutualFrictionB: lineDensity?.mutualFrictionB ?? null,
      geometry,
      geometrySource: info.source,
    };
    if (args.flag(JSON_FLAG.name)) writeJson(io, result);
    else io.stdout(`${renderSweep(result).join('\n')}\n`);
    return EXIT_OK;
  },
};

interface ReferenceValues {
  width0_Hz: number;
  width0Sd_Hz: number;
  amplitude0: number;
  amplitude0Sd: number;
  covariance0: number;
}

function fromFit(fit: ResonanceFit): ReferenceValues {
  return { width0_Hz: fit.width_Hz, width0Sd_Hz: fit.widthSd_Hz, amplitude0: fit.amplitude, amplitude0Sd: fit.amplitudeSd, covariance0: fit.covariance[1][2] };
}

function readTypedReference(args: Parameters<Command['run']>[0]): ReferenceValues | null {
  const width0 = optionalInRange(args, WIDTH0_FLAG);
  const amplitude0 = optionalInRange(args, AMPLITUDE0_FLAG);
  const width0Sd = optionalInRange(args, WIDTH0_SD_FLAG);
  const amplitude0Sd = optionalInRange(args, AMPLITUDE0_SD_FLAG);
  if (width0 === undefined && amplitude0 === undefined) {
    if (width0Sd !== undefined || amplitude0Sd !== undefined) throw new UsageError(`--${width0Sd !== undefined ? 'width0-sd' : 'amplitude0-sd'} needs --width0 and --amplitude0`);
    return null;
  }
  if (width0 === undefined || amplitude0 === undefined) throw new UsageError(`--${width0 === undefined ? 'width0' : 'amplitude0'} is needed too: a typed reference is Δ₀ and A₀`);
  return { width0_Hz: width0, width0Sd_Hz: width0Sd ?? 0, amplitude0, amplitude0Sd: amplitude0Sd ?? 0, covariance0: 0 };
}

function resonanceLines(label: string, r: ResonanceJson): string[][] {
  return [
    [`${label} centre f₀`, `${formatSignificant(r.frequency_Hz, 9)} ± ${formatSignificant(r.frequencySd_Hz, 2)}`, 'Hz'],
    ['  width Δ', `${formatSignificant(r.width_Hz, 5)} ± ${formatSignificant(r.widthSd_Hz, 2)}`, 'Hz'],
    ['  amplitude A', `${formatSignificant(r.amplitude, 5)} ± ${formatSignificant(r.amplitudeSd, 2)}`, ''],
    ['  Q = f₀/Δ', `${formatSignificant(r.q, 5)} ± ${formatSignificant(r.qSd, 2)}`, `${r.points} points, ${r.kind === 'complex' ? 'x and y' : 'amplitude only'}`],
  ];
}

export function renderSweep(r: SweepJson): string[] {
  const rows = [...resonanceLines('Resonance', r.resonance)];
  if (r.reference?.resonance) rows.push(...resonanceLines('Reference', r.reference.resonance));
  else if (r.reference) rows.push(['Reference (typed)', `Δ₀ ${formatSignificant(r.reference.width0_Hz)} Hz, A₀ ${formatSignificant(r.reference.amplitude0)}`, '']);
  if (r.speed_m_s !== null) rows.push(['Speed 2 d f₀/n', `${formatSignificant(r.speed_m_s)} ± ${formatSignificant(r.speedSd_m_s ?? 0, 2)}`, `m/s (n = ${r.mode}, d = ${formatSignificant((r.gapCold_m ?? 0) * 1e3, 6)} mm cold)`]);
  if (r.lineDensity_m2 !== null) {
    rows.push([
      'Line density L',
      `${formatSignificant(r.lineDensity_m2, 4)} ± ${formatSignificant(r.lineDensitySd_m2 ?? 0, 2)}`,
      `m⁻² (sweep ${formatSignificant(r.lineDensitySdMeasurement_m2 ?? 0, 2)}, reference ${formatSignificant(r.lineDensitySdReference_m2 ?? 0, 2)}; B = ${formatSignificant(r.mutualFrictionB ?? 0, 4)} at ${r.temperature_K?.toFixed(4)} K, ${r.temperatureFrom})`,
    ]);
    rows.push(['  width form', `${formatSignificant(r.lineDensityFromWidth_m2 ?? 0, 4)} ± ${formatSignificant(r.lineDensityFromWidthSd_m2 ?? 0, 2)}`, 'm⁻² (6π(Δ − Δ₀)/(Bκ), a check)']);
  }
  const lines = [...alignTable(rows, ['left', 'right', 'left'])];
  if (r.lineDensity_m2 !== null) lines.push(`  Tangle: ${r.geometry} — ${r.geometrySource}.`);
  for (const w of r.resonance.warnings) lines.push(`Caution (sweep): ${w.message}`);
  for (const w of r.reference?.resonance?.warnings ?? []) lines.push(`Caution (reference): ${w.message}`);
  lines.push('');
  if (r.candidates.length > 0 || r.speed_m_s !== null) {
    lines.push(`Temperatures with this speed (${r.candidates.length}):`, ...renderCandidates(r.candidates, r.chosen).map((l) => `  ${l}`), '', `  ${INTERVAL_LEGEND}`, '');
    const chosen = r.chosen === null ? null : r.candidates[r.chosen];
    lines.push(chosen ? `Chosen: ${(r.chosen ?? 0) + 1}, ${chosen.temperature_K.toFixed(5)} K: ${r.choice}` : `Not chosen: ${r.choice}`);
  } else lines.push(`Temperature: ${r.modeReason}`);
  lines.push(...renderWarnings(r.warnings));
  return lines;
}
