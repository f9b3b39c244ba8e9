/**
 * `sekundo resonator`: plan a plane-parallel second-sound resonator before a cooldown — the modes
 * f_n = n u₂/(2d) with df_n/dT, the mode spacing, the frequency step a target temperature
 * resolution needs, the plates' Fresnel numbers and the smallest line density an amplitude noise
 * allows (kernel planResonator).
 */
import { planResonator, RESONATOR_LIMITS, type ResonatorPlan, type TangleGeometry } from '../../physics';
import { type NumberFlag, type QuantityFlag, requireQuantity } from '../args';
import type { Command } from '../command';
import { EXIT_OK, UsageError } from '../errors';
import { alignTable, formatSignificant } from '../format';
import { computeFor, kernelCall } from '../kernel-call';
import { GAP_FLAG, GAP_SD_FLAG, GEOMETRY_FLAG, inRange, readGap, readGeometry, SPACER_FLAG, TEMPERATURE_FLAG } from './resonator-shared';
import { JSON_FLAG, writeJson } from './shared';

const MODES_FLAG: NumberFlag = {
  kind: 'number',
  name: 'modes',
  placeholder: 'N',
  range: RESONATOR_LIMITS.modes,
  integer: true,
  help: 'list modes n = 1 … N (default 10)',
};

const PLATE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'plate-diameter',
  dimension: 'length',
  placeholder: 'D',
  range: RESONATOR_LIMITS.plateDiameter_m,
  help: 'diameter of the smaller plate: gives the Fresnel number a²/(λd) of each mode',
};

const TARGET_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'target-sd',
  dimension: 'temperature difference',
  placeholder: 'δT',
  range: RESONATOR_LIMITS.targetSd_K,
  help: 'target temperature resolution: gives the frequency step each mode must resolve',
};

const WIDTH0_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'width0',
  dimension: 'frequency',
  placeholder: 'Δ₀',
  range: RESONATOR_LIMITS.width0_Hz,
  help: 'expected full width of a vortex-free resonance (with --noise: the smallest line density)',
};

const NOISE_FLAG: NumberFlag = {
  kind: 'number',
  name: 'noise',
  placeholder: 'σA/A₀',
  range: RESONATOR_LIMITS.amplitudeNoise,
  help: 'amplitude noise as a fraction of the vortex-free peak amplitude (with --width0)',
};

/** The JSON printed by `resonator`. */
export interface ResonatorJson extends ResonatorPlan {
  gap_m: number;
  spacer: string | null;
  temperature_K: number;
  targetSd_K: number | null;
  geometry: TangleGeometry;
}

export const resonatorCommand: Command = {
  name: 'resonator',
  summary: 'plan a second-sound resonator: modes and df/dT, spacing, frequency resolution, Fresnel number, smallest line density',
  synopsis: ['resonator --gap <d> --temperature <T> [--spacer <MATERIAL>] [--modes <N>] [--plate-diameter <D>] [--target-sd <δT>] [--width0 <Δ₀> --noise <σA/A₀>] [--json]'],
  description:
    'Plans a plane-parallel resonator (heater plate and sensor plate a gap d apart): the modes f_n = n u₂/(2d) ' +
    '(ideal plates) up to --modes with df_n/dT = f_n (du₂/dT)/u₂, which vanishes at the u₂ minimum (1.12 K) and ' +
    'maximum (1.65 K); the mode spacing u₂/(2d); with --target-sd the frequency step a temperature step of that ' +
    'size makes (what the readout must resolve; second order at the extremes); with --plate-diameter each mode\'s ' +
    'Fresnel number a²/(λd), with a note when diffraction will limit Q; with --width0 and --noise the smallest ' +
    'line density the amplitude noise allows (1 sd and 3 sd, for the --geometry tangle). A gap measured warm is ' +
    'contracted with --spacer. With --json prints {modes: [{n, frequency_Hz, dfdT_Hz_K, frequencyStep_Hz, ' +
    'fresnelNumber}], gapCold_m, gapColdSd_m, speed_m_s, slope_m_s_K, modeSpacing_Hz, relativeStep, insensitiveAt_K, ' +
    'lineDensityNoise_m2, lineDensityDetectable_m2, notes, …}.',
  flags: [GAP_FLAG, GAP_SD_FLAG, SPACER_FLAG, TEMPERATURE_FLAG, MODES_FLAG, PLATE_FLAG, TARGET_FLAG, WIDTH0_FLAG, NOISE_FLAG, GEOMETRY_FLAG, JSON_FLAG],
  examples: [
    'resonator --gap 2mm --temperature 1.65K --modes 20 --json',
    'resonator --gap 10mm --spacer stainless-304 --temperature 1.85K --plate-diameter 25mm --target-sd 10uK',
    'resonator --gap 10mm --temperature 1.85K --width0 2.4Hz --noise 0.001',
  ],
  run(args, io) {
    requireQuantity('resonator', args, GAP_FLAG);
    const T = requireQuantity('resonator', args, TEMPERATURE_FLAG);
    const gap = readGap(args);
    if (!gap) throw new UsageError('"sekundo resonator" needs --gap');
    const width0 = args.quantity(WIDTH0_FLAG.name);
    if (width0) inRange(width0);
    const noise = args.number(NOISE_FLAG.name);
    if ((width0 === undefined) !== (noise === undefined)) throw new UsageError(`--${width0 ? NOISE_FLAG.name : WIDTH0_FLAG.name} is needed with --${width0 ? WIDTH0_FLAG.name : NOISE_FLAG.name}: the smallest line density needs both`);
    const target = args.quantity(TARGET_FLAG.name);
    const plate = args.quantity(PLATE_FLAG.name);
    for (const arg of [target, plate]) if (arg) inRange(arg);
    const geometry = readGeometry(args);
    inRange(T);
    const temperature_K = computeFor(T, (v) => {
      if (v >= RESONATOR_LIMITS.temperature_K[1]) throw new UsageError(`--temperature ${T.text.trim()} is not below Tλ: no second sound, no resonator`);
      return v;
    });
    const plan = kernelCall(() =>
      planResonator({
        gap_m: gap.gapAsGiven_m,
        gapSd_m: args.quantity(GAP_SD_FLAG.name)?.value ?? 0,
        spacerId: gap.spacer,
        temperature_K,
        modes: args.number(MODES_FLAG.name)?.value ?? 10,
        geometry,
        ...(plate ? { plateDiameter_m: plate.value } : {}),
        ...(target ? { targetSd_K: target.value } : {}),
        ...(width0 && noise ? { width0_Hz: width0.value, amplitudeNoise: noise.value } : {}),
      }),
    );
    const result: ResonatorJson = { gap_m: gap.gapAsGiven_m, spacer: gap.spacer, temperature_K, targetSd_K: target?.value ?? null, geometry, ...plan };
    if (args.flag(JSON_FLAG.name)) writeJson(io, result);
    else io.stdout(`${renderResonator(result).join('\n')}\n`);
    return EXIT_OK;
  },
};

export function renderResonator(r: ResonatorJson): string[] {
  const head = alignTable(
    [
      ['Gap (cold)', `${formatSignificant(r.gapCold_m * 1e3, 6)} ± ${formatSignificant(r.gapColdSd_m * 1e3, 2)}`, 'mm', r.spacer ? `from ${formatSignificant(r.gap_m * 1e3, 6)} mm warm on ${r.spacer}` : 'as given'],
      ['Second sound u₂', formatSignificant(r.speed_m_s), 'm/s', `at ${r.temperature_K} K, du₂/dT = ${formatSignificant(r.slope_m_s_K, 4)} m/s/K`],
      ['Mode spacing u₂/2d', formatSignificant(r.modeSpacing_Hz), 'Hz', ''],
      ...(r.relativeStep !== null && r.targetSd_K !== null
        ? [['Frequency step δf/f', formatSignificant(r.relativeStep, 3), '', `for δT = ${formatSignificant(r.targetSd_K * 1e6, 3)} µK (every mode alike)`]]
        : []),
      ...(r.lineDensityNoise_m2 !== null
        ? [['Line density noise', `${formatSignificant(r.lineDensityNoise_m2, 3)} (1 sd), ${formatSignificant(r.lineDensityDetectable_m2 ?? Number.NaN, 3)} (3 sd)`, 'm⁻²', `${r.geometry} tangle`]]
        : []),
    ],
    ['left', 'right', 'left', 'left'],
  );
  const table = alignTable(
    [
      ['n', 'f_n (Hz)', 'df/dT (Hz/K)', 'step (Hz)', 'Fresnel N'],
      ...r.modes.map((m) => [
        String(m.n),
        formatSignificant(m.frequency_Hz, 7),
        formatSignificant(m.dfdT_Hz_K, 4),
        m.frequencyStep_Hz === null ? '' : formatSignificant(m.frequencyStep_Hz, 3),
        m.fresnelNumber === null ? '' : formatSignificant(m.fresnelNumber, 3),
      ]),
    ],
    ['right', 'right', 'right', 'right', 'right'],
  );
  return [
    ...head,
    '',
    ...table,
    '',
    `df/dT = 0 at the u₂ minimum ${r.insensitiveAt_K.minimum.toFixed(4)} K and maximum ${r.insensitiveAt_K.maximum.toFixed(4)} K.`,
    ...r.notes.map((n) => `${n.severity === 'caution' ? 'Caution' : 'Note'}: ${n.message}`),
  ];
}
