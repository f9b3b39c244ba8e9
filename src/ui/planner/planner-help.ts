/**
 * Help for every input of the planner: what it is, the units it takes, typical values and the
 * valid range, and where its value comes from. Shown by the fields' "?" buttons (or a table
 * column's) and read out with each field (src/ui/help/FieldHelp.tsx).
 *
 * The valid range is never typed here: number fields take it from their spec in plan-fields.ts
 * (fieldRangeText, the same text validation uses), other limits from the plan-file schema and the
 * kernel, so help and validation cannot disagree.
 */
import { MAX_ID_CHARS, MAX_LABEL_CHARS, MAX_NAME_CHARS, MAX_NOTES_CHARS, MAX_REFLECTORS } from '../../io/plan-file';
import { unitsOf } from '../../io/quantity';
import {
  CUSTOM_PULSE_MAX_POINTS,
  SAMPLES_PER_EDGE,
  SPACER_MATERIALS,
  strongHeatingFlux,
  T_LAMBDA_K,
  vapourPressure,
} from '../../physics';
import type { HelpTopic } from '../help/FieldHelp';
import type { NumberField } from './plan-fields';

/** Where every plan value starts. */
const PLAN = 'the plan in use: at first the demo plan, an invented test insert (not a real experiment), or a plan file or link you open';
const fromPlan = (note?: string) => (note ? `${PLAN}. ${note}` : PLAN);
const RULE = 'common practice, no source';

/** A number field's help, less the parts its spec gives (units and valid range). */
interface NumberTopic {
  what: string;
  /** Typical values; the valid range from the field's spec follows. */
  typical: string;
  /** Why the plan's value is what it is, after "the plan in use". */
  note?: string;
}

/** Saturated vapour pressure at a temperature, kPa, for typical-value text (from the kernel's ITS-90 curve). */
const kPaAt = (T_K: number) => (vapourPressure(T_K).pressure_Pa / 1000).toPrecision(2);
/** The strong-heating flux for a 1 ms pulse at 1.8 K, W/cm² (the kernel's Gorter–Mellink estimate). */
const STRONG_FLUX_W_CM2 = Number((strongHeatingFlux(1.8, 1e-3) / 1e4).toPrecision(2));

/** Number fields by help key: the field key without its row (sensor.distance, plane.position, pulse.time). */
export const PLAN_NUMBER_HELP: Readonly<Record<string, NumberTopic>> = {
  'bath.temperature': {
    what: 'Temperature of the He II bath on ITS-90 (T90). It sets u₂ and every helium property the plan uses.',
    typical: `1.3–2.1 K for most second-sound work; there is second sound only below Tλ = ${T_LAMBDA_K} K`,
  },
  'bath.vapourPressure': {
    what: 'The saturated vapour pressure read over the bath, instead of a temperature; the planner turns it into T90 with the helium-4 vapour-pressure scale (the hint below shows the temperature).',
    typical: `about ${kPaAt(1.3)}–${kPaAt(2.1)} kPa between 1.3 and 2.1 K`,
  },
  'bath.liquidDepth': {
    what: 'Depth of liquid above the setup. Its hydrostatic head raises the pressure at the setup and so lowers Tλ there a little; the planner cautions when the bath is that close to Tλ.',
    typical: 'a few cm to about 1 m in a bath cryostat',
  },
  'heater.area': {
    what: 'Nominal area of a small (point) heater, used only to turn power into flux; its pulse follows dP/dt and does not depend on it.',
    typical: 'a few mm² or less',
  },
  'heater.sideX': {
    what: 'Width of a film heater (along x). Every sized heater is computed as a baffled piston: the plane-wave value q/(ρ cₚ u₂) holds only up to about a²/(2u₂τ), a half the shorter side; beyond, the pulse turns short and bipolar.',
    typical: 'a few mm to a few cm for a film heater',
  },
  'heater.sideY': {
    what: 'Height of a film heater (along y). With the width it fixes the area and so the power (P = q·A).',
    typical: 'a few mm to a few cm for a film heater',
  },
  'heater.radius': {
    what: 'Radius of a disk heater set flush in a wall, computed as a baffled piston. Far from a small disk the pulse falls as 1/z and turns bipolar.',
    typical: 'a few mm',
  },
  'heater.power': {
    what: 'Peak electrical power in the heater during the pulse (all of it taken to enter the helium).',
    typical: 'mW to a few W',
  },
  'heater.flux': {
    what: 'Peak heat flux on the heater face, q = P/A. The temperature step of the pulse grows with it.',
    typical: `tens to a few hundred mW/cm² for gentle, linear pulses; the planner cautions from half the strong-heating flux and stops at it (about ${STRONG_FLUX_W_CM2} W/cm² for a 1 ms pulse at 1.8 K, rising as τ^(−1/4) for shorter ones and changing with the bath; a one-dimensional Gorter–Mellink estimate), where the liquid at the heater reaches Tλ`,
  },
  'heater.width': {
    what: 'Duration of the heater pulse. A shorter pulse gives a sharper arrival (better timing); a longer one carries more energy.',
    typical: `10 µs–1 ms, short against the time of flight (${RULE})`,
  },
  'heater.riseTime': {
    what: 'Edge time of a rectangular drive, from zero to full power (and back). It limits how steep the arrival can be.',
    typical: `about 1 µs or less from a pulse generator (${RULE})`,
  },
  'heater.repetitionRate': {
    what: 'Pulses per second. Each pulse and its echoes should have died away before the next; the mean heat load on the bath grows with the rate.',
    typical: `1–20 Hz (${RULE})`,
  },
  'heater.averages': {
    what: 'Number of pulses averaged into one record. Uncorrelated noise falls as 1/√N, so the signal-to-noise ratio grows as √N.',
    typical: `1–1000 (${RULE})`,
  },
  'pulse.time': {
    what: 'Time of a point of the custom pulse, from its onset; times increase down the list. The pulse runs in straight lines between the points and ends at the last one.',
    typical: 'from 0 to the pulse width, in order',
  },
  'pulse.amplitude': {
    what: 'Relative amplitude of the drive at that time. Only the shape counts: the points are scaled so the largest is 1, and the flux or power above sets the peak.',
    typical: '0–1',
  },
  'sensor.distance': {
    what: 'Distance of the sensor from the heater centre along the heater’s axis (+z), as measured: warm or cold, see the spacer below.',
    typical: 'a few mm to about 100 mm; at about 20 m/s a 20 mm path takes about 1 ms',
  },
  'sensor.x': {
    what: 'Sensor position across the heater axis (x), from the heater centre.',
    typical: '0 on the axis; off axis, within the cell',
  },
  'sensor.y': {
    what: 'Sensor position across the heater axis (y), from the heater centre.',
    typical: '0 on the axis; off axis, within the cell',
  },
  'sensor.z': {
    what: 'Sensor height above the heater face along its axis (z); the heater faces +z.',
    typical: 'a few mm to about 100 mm',
  },
  'sensor.distanceSd': {
    what: 'One standard deviation of the heater–sensor distance (machining and assembly tolerance). It enters the temperature uncertainty directly.',
    typical: `10–50 µm for machined spacers (${RULE})`,
  },
  'sensor.area': {
    what: 'Sensing area facing the heater; 0 is a point. A wide sensor averages the pulse over its face, which blurs the arrival from a small heater.',
    typical: 'about 1 mm² for a film bolometer (from memory)',
  },
  'sensor.responsivity': {
    what: 'Output volts per kelvin of temperature change at the sensor, at its bias and the bath temperature: from the sensor’s calibration.',
    typical: 'depends on the thermometer, its bias and the amplifier gain; read it off your calibration',
  },
  'sensor.noise': {
    what: 'rms noise of the sensor’s output in one record (single shot, before averaging), over the recording bandwidth, on the same scale as the responsivity.',
    typical: 'depends on the sensor, its bias and the amplifier; measure it on a record without a pulse',
  },
  'sensor.lag': {
    what: 'Time constant τ of the sensor’s response (first-order lag). It delays and smooths the arrival; the planner adds it to the flight time.',
    typical: 'a few µs to tens of µs for a thin-film bolometer (from memory)',
  },
  'plane.position': {
    what: 'Where the reflecting plane lies on its axis (“axis = position”, from the heater centre): z = 0 is the heater’s own plate.',
    typical: 'a wall or lid of the cell, tens of mm away',
  },
  'plane.reflection': {
    what: 'A measured amplitude reflection coefficient R of the plane, used instead of the solid-wall value. A solid wall reflects R = (Z − h)/(Z + h), Z = ρ cₚ u₂ (about 8.5 MW/(m²·K) at 1.8 K) far above the Kapitza conductance h (order kW/(m²·K)), so R ≈ 1; type R only when you have measured a wall that absorbs more (a porous or heated surface).',
    typical: 'leave as “solid wall” unless measured; 1 sends the whole temperature pulse back, 0 absorbs it',
  },
  echoOrder: {
    what: 'Most reflections followed along one echo path (0: direct arrivals only). Higher orders show later, weaker echoes on the timeline.',
    typical: '2–4',
  },
  'digitiser.sampleRate': {
    what: 'Samples per second of the digitiser or scope. Timing needs several samples on the steepest edge of the arrival.',
    typical: `1–100 MS/s; the planner wants ${SAMPLES_PER_EDGE} samples or more on the edge (${RULE})`,
  },
  'digitiser.recordLength': {
    what: 'Length of one record from its first sample, pre-trigger included. It must reach past the last arrival or echo you want.',
    typical: 'a few times the longest time of flight',
  },
  'digitiser.preTrigger': {
    what: 'Time recorded before the heater pulse starts: the baseline and the noise of each trace come from it.',
    typical: `5–10 % of the record (${RULE})`,
  },
  'targets.snr': {
    what: 'Peak signal over rms noise, after averaging, that the measurement should reach; the planner says how many pulses each sensor needs for it.',
    typical: `30–1000 (${RULE})`,
  },
  'targets.temperatureSd': {
    what: 'One-sigma uncertainty the time of flight should give: of one absolute reading (judged with the sd that includes the u₂ curve’s own uncertainty) or of a change between readings (timing only), as chosen beside it; the planner says whether each sensor meets it and the shortest path that would.',
    typical: '0.1–1 mK',
  },
};

/** The help key of a field key: the field key with a table row's key or index left out. */
export function planHelpKey(fieldKey: string): string {
  const parts = fieldKey.split('.');
  if (parts.length === 3 && (parts[0] === 'sensor' || parts[0] === 'plane' || parts[0] === 'pulse')) return `${parts[0]}.${parts[2]}`;
  return fieldKey;
}

/** The units a number field takes, from the parser's own unit table. */
export function planUnitsText(field: NumberField): string {
  if (!field.kind) return field.integer ? 'a whole number, no unit' : 'a plain number, no unit';
  const { dimension, example } = field.kind;
  const units = unitsOf(dimension);
  return `any ${dimension} unit, typed after the number (${units.join(', ')}), e.g. ${example}; a bare number is in the unit shown beside the box`;
}

/**
 * The whole help of a number field. `validRange` is the field's range as its messages give it
 * (fieldRangeText against the plan in use), so ranges that follow other fields stay current.
 */
export function planNumberHelp(field: NumberField, validRange: string): HelpTopic {
  const topic = PLAN_NUMBER_HELP[planHelpKey(field.key)];
  if (!topic) throw new Error(`No help for the planner field “${field.key}”.`);
  return { what: topic.what, units: planUnitsText(field), range: `typically ${topic.typical}; valid ${validRange}`, origin: fromPlan(topic.note) };
}

const materials = SPACER_MATERIALS.map((m) => m.name).join(', ');
const contractions = SPACER_MATERIALS.map((m) => m.contraction * 100);
const contractionRange = `${Math.min(...contractions).toFixed(2)}–${Math.max(...contractions).toFixed(2)} %`;

/** The planner's other inputs: names, choices and the position and plane columns. */
export const PLAN_OTHER_HELP = {
  'plan.name': {
    what: 'A name for the plan, saved in the plan file and shown when it is opened again.',
    range: `1–${MAX_NAME_CHARS} characters`,
    origin: fromPlan(),
  },
  'plan.notes': {
    what: 'What this plan is for, in your words: the insert, the cooldown, what to check. It travels with the plan file and the share link and prints under the title of the setup sheet; left empty, nothing is printed.',
    range: `0–${MAX_NOTES_CHARS} characters`,
    origin: 'Empty for a new plan; the demo’s text describes its invented setup.',
  },
  'bath.mode': {
    what: 'Give the bath as its temperature, or as the vapour pressure read over it (the planner then finds the temperature on the helium-4 vapour-pressure scale).',
    origin: fromPlan('The demo gives a vapour-pressure reading'),
  },
  'heater.geometry': {
    what: 'How the heater’s pulse spreads. Rectangle (a film, width × height) and disk: computed with their size as a baffled piston (Stepanishen 1971): on short paths the plane wave q/(ρ cₚ u₂), beyond about a²/(2u₂τ) a shorter, bipolar pulse falling as 1/z. Point on a wall: a small heater radiating into a half space (2π); point in the liquid: standing free, radiating into 4π — half the signal. A point’s signal follows dP/dt.',
    origin: fromPlan(),
  },
  'targets.kind': {
    what: 'What the temperature sd target is for. An absolute reading: its sd includes the u₂ curve’s own uncertainty, which no distance removes. A change between readings: the distance error and the curve’s error are common to every reading, so only timing counts.',
    origin: fromPlan('Files from version 1 read it as absolute'),
  },
  'plane.source': {
    what: 'Where the plane’s R comes from: a solid wall, R = (Z − h)/(Z + h) from the second-sound impedance Z = ρ cₚ u₂ and an order-of-magnitude Kapitza conductance h ≈ 500·T³ W/(m²·K) (Pollack, Rev. Mod. Phys. 41, 48 (1969)), or a value you measured.',
    origin: fromPlan('New planes are solid walls'),
  },
  'heater.drive': {
    what: 'Give the drive as peak heat flux on the face (q) or as peak power (P); the other follows from the area, P = q·A.',
    origin: fromPlan(),
  },
  'heater.shape': {
    what: 'Time course of the drive: a rectangle whose edges take the rise time, a half-sine sin(πt/τ) over the width, or straight lines through points you give.',
    origin: fromPlan(),
  },
  'pulse.paste': {
    what: 'Replace the custom pulse by pasted lines, one “time, amplitude” per line (from a spreadsheet or a scope export); # starts a comment.',
    units: 'time with a unit (20 us, 0.5 ms); a bare time is in seconds. Amplitude: a plain number, 0 or more',
    range: `2–${CUSTOM_PULSE_MAX_POINTS} lines`,
    origin: 'empty; the points in use stay until you apply new ones',
  },
  'sensor.id': {
    what: 'A short id for the sensor, used in the results, on the timeline and in exported CSV files.',
    range: `1–${MAX_ID_CHARS} characters, different for each sensor`,
    origin: fromPlan('A new sensor gets the next free id'),
  },
  'sensor.label': {
    what: 'A longer description of the sensor (type, place), for your own reading; saved in the plan file.',
    range: `1–${MAX_LABEL_CHARS} characters`,
    origin: fromPlan(),
  },
  'plane.label': {
    what: 'A name for the reflecting plane (a plate, a lid, a wall), used in echo names and warnings.',
    range: `1–${MAX_LABEL_CHARS} characters`,
    origin: fromPlan(`A plan holds at most ${MAX_REFLECTORS} planes`),
  },
  'plane.axis': {
    what: 'Which axis the plane crosses: z = a plane across the heater axis (a plate or lid), x or y = a side wall parallel to it.',
    origin: fromPlan(),
  },
  'spacer.materialId': {
    what: `What holds the sensors at their distances; its thermal contraction from room temperature to 4 K turns warm distances into cold ones. Known: ${materials}.`,
    range: `contraction ${contractionRange} among these (handbook values from memory; check your material)`,
    origin: fromPlan(),
  },
  'spacer.measuredWarm': {
    what: 'Tick when the distances were measured at room temperature: they are shrunk by the spacer’s contraction and its uncertainty is added. Leave it off for distances already cold.',
    origin: fromPlan('The demo’s distances were measured warm'),
  },
  'map.sensor': {
    what: 'Whose timing sd and distance sd the resolution map uses: it shows how finely one reading with that sensor would pin the bath temperature, at every temperature and distance on the map (not only the planned ones).',
    origin: 'the first sensor of the plan',
  },
} as const satisfies Record<string, HelpTopic>;

export type PlanOtherHelpKey = keyof typeof PLAN_OTHER_HELP;

/** Help for the sensor position column: how it is given, and each coordinate's range. */
export function sensorPositionHelp(ranges: { distance: string; x: string; z: string }, units: string): HelpTopic {
  return {
    what: 'Where the sensor sits, from the heater centre; the heater faces +z. “On axis”: one distance along the axis. “x y z”: a position anywhere in front of the heater (for sensors off the axis).',
    units,
    range: `typically a few mm to about 100 mm; valid: distance ${ranges.distance}, x and y ${ranges.x}, z ${ranges.z}`,
    origin: fromPlan(),
  };
}

