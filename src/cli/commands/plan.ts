/**
 * `sekundo plan FILE [--json] [--waveform]`: the full measurement plan for a plan file (format
 * "sekundo-plan"): arrivals, pulse size, echoes, SNR and temperature resolution for every sensor,
 * the heater summary and every warning.
 */
import {
  CURRENT_PLAN_VERSION,
  explainPlanError,
  type PlanBath,
  type PlanFile,
  type PlanMigrationNote,
  PLAN_FORMAT,
  parsePlanFile,
  planBath,
  planFileToInput,
} from '../../io/plan-file';
import { MAX_PLAN_FILE_BYTES, planTextFromBytes } from '../../io/plan-text';
import { fromBaseUnit } from '../../io/quantity';
import { computePlan, PhysicsError, type PlanResult, type SampledSignal, TIMING_SNR_LIMIT } from '../../physics';
import type { BooleanFlag, OperandSpec } from '../args';
import type { Command } from '../command';
import { EXIT_OK, UsageError } from '../errors';
import { ABSENT, alignTable, formatPlain, formatSignificant } from '../format';
import { readFileCapped, shownPath } from '../io';
import { formatKelvin, formatMillikelvin, JSON_FLAG, writeJson } from './shared';

const FILE_OPERAND: OperandSpec = {
  name: 'file',
  placeholder: 'FILE',
  help: `a plan file (JSON, "format": "${PLAN_FORMAT}"), e.g. public/demo-plan.json`,
};

const WAVEFORM_FLAG: BooleanFlag = {
  kind: 'boolean',
  name: 'waveform',
  help: 'with --json, add the predicted δT(t) of every sensor and the heater pulse (thousands of numbers)',
};

/** Problems quoted on the one error line; the rest are counted. */
const MESSAGES_SHOWN = 5;

/** A sampled signal as JSON: plain numbers instead of a typed array. */
export interface JsonSignal {
  start_s: number;
  step_s: number;
  values: number[];
}

/** The `plan` command. */
export const planCommand: Command = {
  name: 'plan',
  summary: 'the full plan for a plan file: arrivals, pulse size, echoes, SNR and resolution per sensor',
  synopsis: ['plan FILE [--json] [--waveform]'],
  description:
    `Reads a plan file (JSON, "format": "${PLAN_FORMAT}", SI units in every key; public/demo-plan.json ` +
    'is an example), checks every field against its valid range, and prints for each sensor when first ' +
    'and second sound arrive, the peak δT, the echoes, the signal-to-noise ratio and how finely the delay ' +
    'pins the temperature (σt: the timing sd of the fraction picker at half the peak, the converter’s ' +
    'default, worked out from the predicted pulse; each picker’s figure below the table), then the heater summary and every warning with its severity. With --json, ' +
    'prints one object {name, bath, temperature_K, heater, record, sensors: [{id, label, pathLength_m, ' +
    'firstSoundArrival_s, secondSoundArrival_s, amplitude_K, echoes, snrAveraged, timingSd_s, ' +
    'timingSdByPicker_s: {threshold, fraction, peak, xcorr}, timingLowerLimit, temperatureSd_K, …}], ' +
    'warnings: [{code, severity, message, sensorId, value, limit}]}; the predicted waveforms are left ' +
    'out unless --waveform is given too. A file that cannot be read or is not a valid plan exits with ' +
    'status 2 and one line naming the field and its valid range.',
  flags: [JSON_FLAG, WAVEFORM_FLAG],
  operands: [FILE_OPERAND],
  examples: ['plan public/demo-plan.json', 'plan public/demo-plan.json --json', 'plan public/demo-plan.json --json --waveform'],
  run(args, io) {
    const path = args.operand(FILE_OPERAND.name);
    if (path === undefined) {
      throw new UsageError(`"sekundo plan" needs a plan file, e.g. sekundo plan public/demo-plan.json`);
    }
    const json = args.flag(JSON_FLAG.name);
    const withWaveforms = args.flag(WAVEFORM_FLAG.name);
    if (withWaveforms && !json) throw new UsageError('--waveform needs --json: the waveforms are only printed as JSON');
    const { plan, migrated } = loadPlanWithNotes(path);
    const { bath, result } = runPlan(path, plan);
    if (json) writeJson(io, { ...planJson(path, plan, bath, result, withWaveforms), migrated });
    else io.stdout(`${[...migrationLines(migrated), ...renderPlanReport(path, plan, bath, result)].join('\n')}\n`);
    return EXIT_OK;
  },
};

/** Reads and validates a plan file; every problem becomes one UsageError line. */
export function loadPlan(path: string): PlanFile {
  return loadPlanWithNotes(path).plan;
}

/** What reading an older plan file changed, as lines before the report. */
function migrationLines(notes: readonly PlanMigrationNote[]): string[] {
  if (notes.length === 0) return [];
  return [
    `Note: this file is plan format version ${notes[0]?.fromVersion}; it was read as version ${CURRENT_PLAN_VERSION}:`,
    ...notes.flatMap((n) => n.changes).map((c) => `  - ${c}`),
    '',
  ];
}

/** {@link loadPlan} with the notes of any migration from an older version. */
export function loadPlanWithNotes(path: string): { plan: PlanFile; migrated: PlanMigrationNote[] } {
  const text = readPlanText(path);
  const parsed = parsePlanFile(text);
  if (parsed.ok) return { plan: parsed.plan, migrated: parsed.migrated };
  const shown = parsed.errors.slice(0, MESSAGES_SHOWN);
  const more = parsed.errors.length - shown.length;
  throw new UsageError(`plan file "${shownPath(path)}" is not valid: ${shown.join('; ')}${more > 0 ? `; and ${more} more` : ''}`);
}

function readPlanText(path: string): string {
  const read = planTextFromBytes(readFileCapped(path, 'plan file', MAX_PLAN_FILE_BYTES));
  if (!read.ok) throw new UsageError(`plan file "${shownPath(path)}" is not valid: ${read.errors.join('; ')}`);
  return read.text;
}

function runPlan(path: string, plan: PlanFile): { bath: PlanBath; result: PlanResult } {
  try {
    const bath = planBath(plan);
    return { bath, result: computePlan(planFileToInput(plan)) };
  } catch (error) {
    if (error instanceof PhysicsError) throw new UsageError(`plan file "${path}": ${explainPlanError(error)}`);
    throw error;
  }
}

function signalJson(signal: SampledSignal): JsonSignal {
  return { start_s: signal.start_s, step_s: signal.step_s, values: Array.from(signal.values) };
}

/** What `plan --json` prints: the kernel's result with the file's own choices beside it. */
export function planJson(path: string, plan: PlanFile, bath: PlanBath, result: PlanResult, withWaveforms: boolean): Record<string, unknown> {
  return {
    file: path,
    name: plan.name,
    notes: plan.notes ?? null,
    bath: { ...bath, liquidDepth_m: plan.bath.liquidDepth_m, headPressure_Pa: result.headPressure_Pa },
    temperature_K: result.temperature_K,
    properties: result.properties,
    heater: {
      geometry: plan.heater.geometry,
      width_m: plan.heater.width_m ?? null,
      height_m: plan.heater.height_m ?? null,
      radius_m: plan.heater.radius_m ?? null,
      mount: plan.heater.mount ?? null,
      shape: shapeName(plan),
      repetitionRate_Hz: plan.heater.repetitionRate_Hz,
      averages: plan.heater.averages,
      ...result.heater,
    },
    planes: result.planes,
    targets: plan.targets,
    record: result.record,
    sensors: result.sensors.map(({ waveform, ...sensor }) => ({
      ...sensor,
      ...(withWaveforms ? { waveform: waveform.map(signalJson) } : {}),
    })),
    warnings: result.warnings.map((w) => ({ code: w.code, severity: w.severity, message: w.message, sensorId: w.sensorId, value: w.value, limit: w.limit })),
    ...(withWaveforms ? { heaterPulse: signalJson(result.heaterPulse) } : {}),
  };
}

function heaterSize(plan: PlanFile): string {
  const h = plan.heater;
  const mm = (x: number | undefined) => formatPlain(Number(((x ?? 0) * 1e3).toPrecision(4)));
  if (h.geometry === 'rectangle') return `rectangle ${mm(h.width_m)} mm × ${mm(h.height_m)} mm`;
  if (h.geometry === 'disk') return `disk, radius ${mm(h.radius_m)} mm`;
  return `point source ${h.mount === 'free' ? 'free in the liquid (4π)' : 'on a wall (2π)'}`;
}

function planeWaveText(plan: PlanFile, result: PlanResult): string {
  const h = result.heater;
  if (h.planeWaveRange_m === null || h.planeWaveEdge_m === null) return 'a point source: its signal follows dP/dt at every distance';
  const which = plan.heater.geometry === 'disk' ? 'the radius' : 'half the shorter side';
  return `computed with its size (baffled piston); the plane-wave value holds for the whole pulse up to about ${sig(h.planeWaveRange_m * 1e3, 3)} mm on the axis (a²/(2u₂τ), a = ${formatPlain(h.planeWaveEdge_m * 1e3)} mm, ${which})`;
}

function shapeName(plan: PlanFile): 'rectangle' | 'half-sine' | 'custom' {
  return typeof plan.heater.shape === 'string' ? plan.heater.shape : 'custom';
}

const sig = (x: number | null, digits?: number): string => (x === null || !Number.isFinite(x) ? ABSENT : formatSignificant(x, digits));
const inUnit = (x: number | null, scale: number, digits?: number): string => (x === null ? ABSENT : sig(x * scale, digits));

/** The human-readable report of `plan`: bath, heater, a table of sensors, echoes, warnings. */
export function renderPlanReport(path: string, plan: PlanFile, bath: PlanBath, result: PlanResult): string[] {
  const h = result.heater;
  const source =
    bath.vapourPressure_Pa === null ? 'as given' : `from a vapour pressure of ${sig(bath.vapourPressure_Pa)} Pa (${bath.scale ?? ''})`;
  const shape = typeof plan.heater.shape === 'string' ? plan.heater.shape : `custom (${plan.heater.shape.custom.length} points)`;
  const summary = alignTable(
    [
      ['Bath', `${formatKelvin(result.temperature_K)} K (${formatMillikelvin(result.temperature_K)} mK) ${source}; liquid depth ${formatPlain(plan.bath.liquidDepth_m)} m, head ${sig(result.headPressure_Pa)} Pa`],
      ['Heater', `${heaterSize(plan)}, ${sig(fromBaseUnit(h.flux_W_m2, 'W/cm2'))} W/cm² = ${sig(h.power_W)} W peak; ${shape}, ${sig(h.duration_s * 1e6)} µs long, edges ${sig(h.effectiveRise_s * 1e6)} µs`],
      ['', planeWaveText(plan, result)],
      ['', `${sig(h.energyPerPulse_J * 1e6)} µJ per pulse; ${formatPlain(plan.heater.repetitionRate_Hz)} Hz → ${sig(h.averagePower_W * 1e3)} mW on average; ${plan.heater.averages} pulses averaged`],
      ['', `δT at the face q/(ρ c_p u₂) ${inUnit(h.faceDeltaT_K, 1e3)} mK; counterflow ${inUnit(h.counterflowVelocity_m_s, 1e2)} cm/s; shock after ${inUnit(h.shockDistance_m, 1e3)} mm${h.shockEdge ? ` (${h.shockEdge} edge steepens)` : ''}`],
      ['', `strong heating from ${inUnit(h.strongHeatingFlux_W_m2, 1e-4, 3)} W/cm² for this pulse (the face reaches Tλ; 1-D Gorter–Mellink, an estimate good to about a factor 2)`],
      ['Planes', result.planes.length === 0 ? 'none' : result.planes.map((p) => `${p.label} ${p.axis} = ${sig(p.position_m * 1e3)} mm cold, R = ${p.reflection.toFixed(4)} (${p.source === 'measured' ? 'measured' : 'solid wall'})`).join('; ')],
      ...[...new Set(result.planes.map((p) => p.note))].map((note) => ['', note]),
      ['Target', `SNR ${sig(plan.targets.snr)}; temperature sd ${sig(plan.targets.temperatureSd_K * 1e3)} mK for ${plan.targets.temperatureKind === 'absolute' ? 'an absolute reading (judged with the u₂ curve’s own sd)' : 'a change between readings (judged with the sd of changes)'}`],
      ['Record', `${formatPlain(result.record.start_s * 1e3)} to ${formatPlain(result.record.end_s * 1e3)} ms around the pulse, a sample every ${formatPlain(result.record.sampleInterval_s * 1e6)} µs`],
    ],
    ['left', 'left'],
  );
  const rows: string[][] = [
    ['Sensor', 'Label', 'Path (mm)', 'u₁ at (ms)', 'u₂ at (ms)', 'δT (mK)', 'SNR avg', 'σt (µs)', 'σT (mK)', 'σT judged (mK)', 'Meets', 'Shortest (mm)', 'Echoes'],
    ...result.sensors.map((s) => [
      s.id,
      s.label,
      `${sig(s.pathLength_m * 1e3)} ± ${sig(s.pathLengthSd_m * 1e3, 2)}`,
      sig(s.firstSoundArrival_s * 1e3),
      inUnit(s.secondSoundArrival_s, 1e3),
      inUnit(s.amplitude_K, 1e3),
      sig(s.snrAveraged, 3),
      `${s.timingLowerLimit ? '≥ ' : ''}${inUnit(s.timingSd_s, 1e6, 2)}`,
      inUnit(s.temperatureSd_K, 1e3, 3),
      inUnit(s.targetKind === 'absolute' ? s.temperatureSdWithModel_K : s.temperatureChangeSd_K, 1e3, 3),
      s.meetsTarget === null ? ABSENT : s.meetsTarget ? 'yes' : 'no',
      s.shortestDistanceForTarget_m === null ? 'not reachable' : sig(s.shortestDistanceForTarget_m * 1e3, 3),
      String(s.echoes.length),
    ]),
  ];
  const lines = [`Plan: ${plan.name}`, `File: ${path}`, '', ...summary, '', ...alignTable(rows, ['left', 'left', 'right', 'right', 'right', 'right', 'right', 'right', 'right', 'right', 'left', 'right', 'right'])];
  const timed = result.sensors.filter((s) => s.timingSdByPicker_s !== null);
  if (timed.length > 0) {
    lines.push(
      '',
      'σt: one averaged reading timed by the fraction picker at half the peak (the converter’s default), from the predicted pulse, noise and sample rate; per picker (µs):',
      ...alignTable(
        timed.map((s) => {
          const t = s.timingSdByPicker_s as Record<'threshold' | 'fraction' | 'peak' | 'xcorr', number | null>;
          return [`  ${s.id}`, `threshold 5σ ${inUnit(t.threshold, 1e6, 2)}`, `fraction 0.5 ${inUnit(t.fraction, 1e6, 2)}`, `peak ${inUnit(t.peak, 1e6, 2)}`, `cross-correlation ${inUnit(t.xcorr, 1e6, 2)}`];
        }),
        ['left', 'left', 'left', 'left', 'left'],
      ),
    );
    const limits = timed.filter((s) => s.timingLowerLimit);
    if (limits.length > 0) {
      lines.push(`  ≥: small-noise figures, lower limits here (SNR after averaging below ${TIMING_SNR_LIMIT}: missed crossings and noise peaks widen the spread): ${limits.map((s) => s.id).join(', ')}; \`sekundo rehearse\` shows the real spread.`);
    }
  }
  const unreachable = result.sensors.filter((s) => s.shortestDistanceNote !== '');
  if (unreachable.length > 0) lines.push('', ...unreachable.map((s) => `${s.id}: ${s.shortestDistanceNote}`));
  const onWall = result.sensors.filter((s) => s.onPlane !== null);
  if (onWall.length > 0) lines.push(...onWall.map((s) => `${s.id}: on the plane "${s.onPlane}", so it sees the incident wave plus its reflection, (1 + R) times.`));
  const echoRows = result.sensors.flatMap((s) =>
    s.echoes.map((e) => [s.id, `${e.order} (${e.path.join(' → ')})`, `${sig(e.arrival_s * 1e3)} ms`, `${sig(e.amplitude_K * 1e3)} mK`]),
  );
  if (echoRows.length > 0) {
    lines.push('', 'Echoes (reflections, path):', ...alignTable(echoRows, ['left', 'left', 'right', 'right']).map((l) => `  ${l}`));
  }
  lines.push('', result.warnings.length > 0 ? 'Warnings:' : 'Warnings: none');
  for (const w of result.warnings) lines.push(`  ${w.severity} (${w.code}${w.sensorId === null ? '' : `, ${w.sensorId}`}): ${w.message}`);
  return lines;
}
