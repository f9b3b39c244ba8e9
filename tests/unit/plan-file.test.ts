import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import {
  CURRENT_PLAN_VERSION,
  explainPlanError,
  formatPlanPath,
  MAX_PLAN_FILE_CHARS,
  MAX_PLAN_MESSAGES,
  migratePlan,
  PLAN_FORMAT,
  PLAN_MIGRATIONS,
  type PlanFile,
  parsePlanFile,
  planBath,
  planFileToInput,
  serializePlanFile,
} from '../../src/io/plan-file';
import { computePlan, InvalidInputError, OutOfRangeError, SPACER_MATERIALS } from '../../src/physics';

const REPO_ROOT = fileURLToPath(new URL('../..', import.meta.url));
const DEMO_TEXT = readFileSync(join(REPO_ROOT, 'public/demo-plan.json'), 'utf8');

// Sources of the numbers below.
const ITS90 = 'ITS-90 helium-4 vapour-pressure equations: 1638.2 Pa is 1.800 K';
const CONTRACTION = 'stainless 304, 293 K → 4 K: 0.30 % (PHYSICS notes §3 and contraction.ts, from memory)';
const SI_AREA = '1 cm² = 1e-4 m² (exact)';

type Json = Record<string, unknown> & { [key: string]: Json | unknown };

/** A fresh copy of the demo plan as plain JSON, to break. */
function demoJson(): Json {
  return JSON.parse(DEMO_TEXT) as Json;
}

function loaded(text: string): PlanFile {
  const result = parsePlanFile(text);
  if (!result.ok) throw new Error(`plan did not load: ${result.errors.join('; ')}`);
  return result.plan;
}

/** The errors for the demo plan after `mutate`; fails the test if it loads. */
function errorsAfter(mutate: (plan: Json) => void): string[] {
  const plan = demoJson();
  mutate(plan);
  return errorsOf(JSON.stringify(plan));
}

function errorsOf(text: string): string[] {
  const result = parsePlanFile(text);
  expect(result.ok).toBe(false);
  return result.ok ? [] : result.errors;
}

/** Every message starts with the field it is about: `plan`, or a top-level field and a path into it. */
const FIELD_MESSAGE = /^(plan|[a-zA-Z]+(\[\d+\]|\[".*"\]|\.[a-zA-Z_0-9]+)*): \S/;

// Loose access to nested JSON in the mutations below.
// biome-ignore lint/suspicious/noExplicitAny: test mutations reach into arbitrary JSON
type Loose = any;
const at = (plan: Json): Loose => plan;

describe('the demo plan', () => {
  const plan = loaded(DEMO_TEXT);

  it('loads, says it is invented, and uses the current format and version', () => {
    expect(plan.format).toBe(PLAN_FORMAT);
    expect(plan.version).toBe(CURRENT_PLAN_VERSION);
    expect(plan.notes).toMatch(/invented/i);
    expect(plan.sensors.length).toBeGreaterThanOrEqual(3);
    expect(plan.sensors.some((s) => s.position_m !== undefined)).toBe(true);
    expect(plan.reflectors).toHaveLength(2);
  });

  it('computes without a warning of severity "stop", with second sound at every sensor', () => {
    const result = computePlan(planFileToInput(plan));
    expect(result.warnings.filter((w) => w.severity === 'stop')).toEqual([]);
    for (const sensor of result.sensors) expect(sensor.secondSoundArrival_s).toBeGreaterThan(0);
  });

  it('round-trips: serialize → parse gives the same plan', () => {
    expect(loaded(serializePlanFile(plan))).toEqual(plan);
  });

  it('serializing is idempotent, and the demo file is already in that canonical form', () => {
    const text = serializePlanFile(plan);
    expect(serializePlanFile(loaded(text))).toBe(text);
    expect(text).toBe(DEMO_TEXT);
  });

  it('writes numeric lists on one line and leaves brackets inside text alone', () => {
    const custom = loaded(
      JSON.stringify({
        ...demoJson(),
        notes: 'brackets in text stay as typed: [1,2]',
        heater: { ...at(demoJson()).heater, shape: { custom: [[0, 0], [1e-5, 1], [5e-5, 0]] }, width_s: undefined, riseTime_s: undefined },
      }),
    );
    const text = serializePlanFile(custom);
    expect(text).toContain('[0.00001, 1]');
    expect(text).toContain('"position_m": [0.006, 0, 0.035]');
    expect(text).toContain('[1,2]');
    expect(loaded(text)).toEqual(custom);
  });

  it('refuses to serialize a plan that is not valid (a programming error)', () => {
    const bad = { ...plan, echoOrder: 99 } as PlanFile;
    expect(() => serializePlanFile(bad)).toThrow(TypeError);
    expect(() => serializePlanFile(bad)).toThrow('echoOrder');
  });
});

describe('malformed plans give field-level messages', () => {
  // [what, mutation, the exact message (or fragments of it)]
  const cases: readonly [name: string, mutate: (p: Json) => void, expected: readonly string[]][] = [
    // Wrong types.
    ['text for a number', (p) => (at(p).heater.width_s = 'abc'), ['heater.width_s: must be a number, 10 ns–10 s (got "abc")']],
    ['number for text', (p) => (at(p).sensors[0].label = 7), ['sensors[0].label: must be text (got 7)']],
    ['text for a list', (p) => (at(p).sensors = 'abc'), ['sensors: must be a list of 1–64 sensors (got "abc")']],
    ['text for a boolean', (p) => (at(p).spacer.measuredWarm = 'yes'), ['spacer.measuredWarm: must be true or false (got "yes")']],
    ['list for an object', (p) => (at(p).digitiser = [1, 2]), ['digitiser: must be an object {…} (got a list of 2)']],
    ['null for an object', (p) => (at(p).targets = null), ['targets: must be an object {…} (got null)']],
    ['unknown geometry', (p) => (at(p).heater.geometry = 'square'), ['heater.geometry: must be one of "rectangle", "disk", "point" (got "square")']],
    ['unknown shape', (p) => (at(p).heater.shape = 'triangle'), ['heater.shape: must be "rectangle", "half-sine" or {"custom"']],
    ['unknown axis', (p) => (at(p).reflectors[1].axis = 'w'), ['reflectors[1].axis: must be one of "x", "y", "z" (got "w")']],
    ['unknown material', (p) => (at(p).spacer.materialId = 'steel'), ['spacer.materialId: must be one of "stainless-304"', '(got "steel")']],
    ['short position', (p) => (at(p).sensors[2].position_m = [0, 0.01]), ['sensors[2].position_m: must be [x, y, z] in metres (got a list of 2)']],
    // Missing fields.
    ['missing label', (p) => delete at(p).sensors[2].label, ['sensors[2].label: required']],
    ['empty label', (p) => (at(p).sensors[2].label = '  '), ['sensors[2].label: required (empty)']],
    ['missing heater', (p) => delete at(p).heater, ['heater: required']],
    ['missing depth', (p) => delete at(p).bath.liquidDepth_m, ['bath.liquidDepth_m: required']],
    ['missing name', (p) => delete at(p).name, ['name: required']],
    ['missing width of a rectangle', (p) => delete at(p).heater.width_s, ['heater.width_s: required for a rectangle pulse, 10 ns–10 s']],
    ['missing rise of a rectangle', (p) => delete at(p).heater.riseTime_s, ['heater.riseTime_s: required for a rectangle pulse']],
    // Extra fields.
    ['extra top-level field', (p) => (p.colour = 'red'), ['colour: unknown field; known fields: format, version, name']],
    ['extra heater field', (p) => (at(p).heater.width_ms = 0.1), ['heater.width_ms: unknown field; known fields: geometry, width_m, height_m', 'width_s']],
    ['extra sensor field', (p) => (at(p).sensors[1].gain = 2), ['sensors[1].gain: unknown field']],
    ['extra field in a custom shape', (p) => (at(p).heater.shape = { custom: [[0, 0], [1e-5, 1]], kind: 'x' }), ['heater.shape.kind: unknown field; known fields: custom']],
    // Negative, zero and huge numbers.
    ['negative width', (p) => (at(p).heater.width_s = -1), ['heater.width_s: must be 10 ns–10 s (got -1)']],
    ['huge repetition rate', (p) => (at(p).heater.repetitionRate_Hz = 1e300), ['heater.repetitionRate_Hz: must be 100 µHz–100 kHz (got 1e+300)']],
    ['negative noise', (p) => (at(p).sensors[3].noise_V = -1e-6), ['sensors[3].noise_V: must be 1 fV–10 V (got -0.000001)']],
    ['zero averages', (p) => (at(p).heater.averages = 0), ['heater.averages: must be a whole number 1–10000000 (got 0)']],
    ['fractional averages', (p) => (at(p).heater.averages = 2.5), ['heater.averages: must be a whole number 1–10000000 (got 2.5)']],
    ['echo order too high', (p) => (at(p).echoOrder = 13), ['echoOrder: must be a whole number 0–12 (got 13)']],
    ['reflection above 1', (p) => (at(p).reflectors[0].reflection = 1.5), ['reflectors[0].reflection: must be from -1 to 1 (got 1.5)']],
    ['temperature above range', (p) => (at(p).bath = { temperature_K: 5, liquidDepth_m: 0.1 }), ['bath.temperature_K: must be 0.3–4.24 K (got 5)']],
    ['vapour pressure above 4.24 K', (p) => (at(p).bath.vapourPressure_Pa = 150000), ['bath.vapourPressure_Pa: must be 0.00183797–103041 Pa (got 150000)']],
    ['distance of 0', (p) => (at(p).sensors[0].distance_m = 0), ['sensors[0].distance_m: must be 1 µm–100 m (got 0)']],
    // Strings that look like numbers.
    ['"NaN"', (p) => (at(p).heater.width_s = 'NaN'), ['heater.width_s: must be a number, 10 ns–10 s (got "NaN")']],
    ['"Infinity"', (p) => (at(p).digitiser.sampleRate_Hz = 'Infinity'), ['digitiser.sampleRate_Hz: must be a number', '(got "Infinity")']],
    ['"1e-6" as text', (p) => (at(p).sensors[0].noise_V = '1e-6'), ['sensors[0].noise_V: must be a number, 1 fV–10 V (got "1e-6")']],
    ['"100us" with a unit', (p) => (at(p).heater.width_s = '100us'), ['heater.width_s: must be a number', '(got "100us")']],
    // Choices that do not fit together.
    ['temperature and pressure both', (p) => (at(p).bath.temperature_K = 1.8), ['bath: give temperature_K or vapourPressure_Pa, not both']],
    ['neither temperature nor pressure', (p) => delete at(p).bath.vapourPressure_Pa, ['bath: give the bath temperature_K (0.3–4.24 K) or a vapourPressure_Pa reading']],
    [
      'disk heater given an area',
      (p) => (at(p).heater.geometry = 'disk'),
      [
        'heater.radius_m: required for a disk heater, 1 µm–500 mm',
        'heater.width_m: not used for a disk heater; give radius_m',
        'heater.height_m: not used for a disk heater; give radius_m',
      ],
    ],
    ['rectangle heater given a radius', (p) => (at(p).heater.radius_m = 0.005), ['heater.radius_m: not used for a rectangle heater; give width_m and height_m']],
    ['rectangle heater without its height', (p) => delete at(p).heater.height_m, ['heater.height_m: required for a rectangle heater, 1 µm–1 m']],
    ['point heater without its mount', (p) => Object.assign(at(p).heater, { geometry: 'point', width_m: undefined, height_m: undefined, area_m2: 1e-6 }), ['heater.mount: required for a point heater: "wall" (radiates into 2π) or "free" (in the liquid, 4π)']],
    ['mount neither wall nor free', (p) => Object.assign(at(p).heater, { geometry: 'point', width_m: undefined, height_m: undefined, area_m2: 1e-6, mount: 'ceiling' }), ['heater.mount: must be one of "wall", "free" (got "ceiling")']],
    ['target kind missing', (p) => delete at(p).targets.temperatureKind, ['targets.temperatureKind: required']],
    ['power and flux both', (p) => (at(p).heater.power_W = 0.1), ['heater: give power_W or flux_W_m2, not both']],
    ['neither power nor flux', (p) => delete at(p).heater.flux_W_m2, ['heater: give the peak power_W (1 nW–10 kW) or the heat flux_W_m2']],
    [
      'flux × area above the power range',
      (p) => Object.assign(at(p).heater, { flux_W_m2: 1e9, width_m: 1, height_m: 1 }),
      ['heater.flux_W_m2: flux × area gives 1 GW, outside the heater power range 1 nW–10 kW'],
    ],
    ['rise longer than the width', (p) => (at(p).heater.riseTime_s = 1e-3), ['heater.riseTime_s: must be 100 ps–100 µs (a millionth of width_s up to width_s) (got 0.001)']],
    ['sensor behind the heater', (p) => (at(p).sensors[2].position_m = [0, 0, -0.01]), ['sensors[2].position_m[2]: must be above 0: the sensor sits in front of the heater']],
    ['sensor in the heater plane', (p) => (at(p).sensors[2].position_m = [0.01, 0, 0]), ['sensors[2].position_m[2]: must be above 0']],
    ['distance and position both', (p) => (at(p).sensors[0].position_m = [0, 0, 0.01]), ['sensors[0]: give distance_m or position_m, not both']],
    ['neither distance nor position', (p) => delete at(p).sensors[0].distance_m, ['sensors[0]: give distance_m on the heater axis (1 µm–100 m) or position_m [x, y, z]']],
    ['repeated sensor id', (p) => (at(p).sensors[1].id = 'b10'), ['sensors[1].id: "b10" is already the id of sensors[0]; ids must be unique']],
    ['no sensors', (p) => (at(p).sensors = []), ['sensors: must be a list of 1–64 sensors (got a list of 0)']],
    ['65 sensors', (p) => (at(p).sensors = Array.from({ length: 65 }, (_, i) => ({ ...at(p).sensors[0], id: `s${i}` }))), ['sensors: must be a list of 1–64 sensors (got a list of 65)']],
    ['17 reflectors', (p) => (at(p).reflectors = Array.from({ length: 17 }, () => at(p).reflectors[0])), ['reflectors: must be a list of 0–16 reflecting planes (got a list of 17)']],
    ['pre-trigger longer than the record', (p) => (at(p).digitiser.preTrigger_s = 1), ['digitiser.preTrigger_s: must be at most recordLength_s (20 ms) (got 1)']],
    [
      'custom points out of order and negative',
      (p) => (at(p).heater.shape = { custom: [[0, 0], [1e-5, 1], [1e-5, 0.5], [2e-5, -1]] }),
      ['heater.shape.custom[3][1]: must be 0–1000000000 (got -1)', 'heater.shape.custom[2][0]: times must increase (got 0.00001 s after 0.00001 s)'],
    ],
    ['custom points all zero', (p) => (at(p).heater.shape = { custom: [[0, 0], [1e-5, 0]] }), ['heater.shape.custom: at least one amplitude must be above 0']],
    ['a single custom point', (p) => (at(p).heater.shape = { custom: [[0, 1]] }), ['heater.shape.custom: must be a list of 2–10000 points']],
    ['custom pulse too short', (p) => (at(p).heater.shape = { custom: [[0, 1], [1e-9, 0]] }), ['heater.shape.custom[1][0]: the pulse must last 10 ns–10 s (got 1e-9 s)']],
    // Format and version.
    ['wrong format', (p) => (p.format = 'other-plan'), ['format: must be "sekundo-plan" (got "other-plan"); is this a Sekundo plan file?']],
    ['missing format', (p) => delete p.format, ['format: must be "sekundo-plan" (got nothing)']],
    ['future version', (p) => (p.version = 3), ['version: this file is version 3, written by a newer Sekundo; this one reads versions 1–2']],
    ['version 0', (p) => (p.version = 0), ['version: must be a whole number; this Sekundo reads versions 1–2 (got 0)']],
    ['fractional version', (p) => (p.version = 1.5), ['version: must be a whole number; this Sekundo reads versions 1–2 (got 1.5)']],
    ['version as text', (p) => (p.version = '1'), ['version: must be a whole number; this Sekundo reads versions 1–2 (got "1")']],
    ['missing version', (p) => delete p.version, ['version: must be a whole number; this Sekundo reads versions 1–2 (got nothing)']],
  ];

  it.each(cases)('%s', (_name, mutate, expected) => {
    const errors = errorsAfter(mutate);
    for (const fragment of expected) expect(errors.some((e) => e.includes(fragment)), `${errors.join('\n')}\nlacks: ${fragment}`).toBe(true);
    for (const error of errors) expect(error).toMatch(FIELD_MESSAGE);
  });

  it('reports exactly "sensors[2].label: required" and nothing else for a missing label', () => {
    expect(errorsAfter((p) => delete at(p).sensors[2].label)).toEqual(['sensors[2].label: required']);
  });

  it('reports every problem at once, cross-field checks included', () => {
    const errors = errorsAfter((p) => {
      at(p).heater.width_s = -1;
      delete at(p).sensors[2].label;
      at(p).bath.temperature_K = 1.8;
      at(p).sensors[1].id = 'b10';
      p.extra = true;
    });
    expect(errors).toEqual(
      expect.arrayContaining([
        'heater.width_s: must be 10 ns–10 s (got -1)',
        'sensors[2].label: required',
        'bath: give temperature_K or vapourPressure_Pa, not both',
        'sensors[1].id: "b10" is already the id of sensors[0]; ids must be unique',
      ]),
    );
    expect(errors.some((e) => e.startsWith('extra: unknown field'))).toBe(true);
  });

  it(`lists at most ${MAX_PLAN_MESSAGES} messages and counts the rest`, () => {
    const points = Array.from({ length: 200 }, (_, i) => [i * 1e-6, -1]);
    const errors = errorsAfter((p) => (at(p).heater.shape = { custom: points }));
    expect(errors).toHaveLength(MAX_PLAN_MESSAGES + 1);
    expect(errors[MAX_PLAN_MESSAGES]).toMatch(/^… and \d+ more problems$/);
  });
});

describe('text that is not a plan', () => {
  const cases: readonly [name: string, text: string, expected: string][] = [
    ['empty', '', 'plan: not valid JSON'],
    ['unfinished', '{"format": "sekundo-plan",', 'plan: not valid JSON'],
    ['single quotes', "{'format': 'sekundo-plan'}", 'plan: not valid JSON'],
    ['a bare NaN', 'NaN', 'plan: not valid JSON'],
    ['NaN as a value', '{"format": "sekundo-plan", "version": NaN}', 'plan: not valid JSON'],
    ['a list', '[1, 2]', 'plan: must be a JSON object {"format": "sekundo-plan", …} (got a list of 2)'],
    ['null', 'null', 'plan: must be a JSON object {"format": "sekundo-plan", …} (got null)'],
    ['a number', '42', 'plan: must be a JSON object {"format": "sekundo-plan", …} (got 42)'],
    ['a string', '"sekundo-plan"', 'plan: must be a JSON object {"format": "sekundo-plan", …} (got "sekundo-plan")'],
  ];
  it.each(cases)('%s', (_name, text, expected) => {
    const errors = errorsOf(text);
    expect(errors).toHaveLength(1);
    expect(errors[0]).toContain(expected);
  });

  it('says where a syntax error is', () => {
    const [error] = errorsOf('{\n  "format": "sekundo-plan",\n  "version": 1,\n}');
    expect(error).toMatch(/^plan: not valid JSON: .*line 4/);
  });

  it('reads a number too large for a double (1e999) as Infinity and refuses it', () => {
    const text = DEMO_TEXT.replace('"width_s": 0.0001', '"width_s": 1e999');
    expect(errorsOf(text)).toEqual(['heater.width_s: must be a number, 10 ns–10 s (got Infinity)']);
  });

  it('accepts a byte-order mark', () => {
    expect(parsePlanFile(`\uFEFF${DEMO_TEXT}`).ok).toBe(true);
  });

  it('refuses deep nesting before parsing it, at the top or inside a field', () => {
    expect(errorsOf('['.repeat(100_000))).toEqual(['plan: nested more than 32 levels deep; a plan file needs at most 5']);
    const deep = `${'['.repeat(40)}0${']'.repeat(40)}`;
    expect(errorsOf(DEMO_TEXT.replace('"shape": "rectangle"', `"shape": ${deep}`))[0]).toContain('nested more than 32 levels');
  });

  it('counts brackets inside strings as text, not nesting', () => {
    const text = DEMO_TEXT.replace('"notes": "', `"notes": "${'[{'.repeat(100)} \\" `);
    expect(parsePlanFile(text).ok).toBe(true);
  });

  it(`refuses a file longer than ${MAX_PLAN_FILE_CHARS} characters`, () => {
    const [error] = errorsOf(DEMO_TEXT + ' '.repeat(MAX_PLAN_FILE_CHARS));
    expect(error).toMatch(/^plan: the file has \d+ characters, more than the 4000000/);
  });

  it('never throws, whatever the JSON (property test)', () => {
    fc.assert(
      fc.property(fc.json(), (text) => {
        const result = parsePlanFile(text);
        expect(result.ok).toBe(false);
        if (!result.ok) for (const e of result.errors) expect(typeof e).toBe('string');
      }),
    );
  });

  it('never throws when any field of the demo is replaced by anything (property test)', () => {
    const paths: readonly (readonly (string | number)[])[] = [
      ['name'],
      ['bath'],
      ['bath', 'vapourPressure_Pa'],
      ['heater'],
      ['heater', 'shape'],
      ['heater', 'width_s'],
      ['sensors'],
      ['sensors', 0],
      ['sensors', 2, 'position_m'],
      ['reflectors', 1],
      ['digitiser', 'preTrigger_s'],
      ['echoOrder'],
    ];
    fc.assert(
      fc.property(fc.constantFrom(...paths), fc.jsonValue(), (path, value) => {
        const plan = demoJson();
        let node: Loose = plan;
        for (const key of path.slice(0, -1)) node = node[key];
        node[path[path.length - 1] as string | number] = value;
        const result = parsePlanFile(JSON.stringify(plan));
        if (result.ok) expect(() => computePlan(planFileToInput(result.plan))).not.toThrow();
        else for (const e of result.errors) expect(e).toMatch(FIELD_MESSAGE);
      }),
      { numRuns: 300 },
    );
  });
});

describe('keys that mean something to JavaScript', () => {
  const cases: readonly [name: string, text: string, expected: string][] = [
    ['__proto__ at the top', '{"__proto__": {"polluted": true}, "format": "sekundo-plan", "version": 1}', '__proto__: this key is not allowed in a plan file'],
    ['__proto__ in the heater', DEMO_TEXT.replace('"heater": {', '"heater": {"__proto__": {"polluted": true},'), 'heater.__proto__: this key is not allowed in a plan file'],
    ['__proto__ in a sensor', DEMO_TEXT.replace('"id": "b25",', '"id": "b25", "__proto__": {"polluted": true},'), 'sensors[1].__proto__: this key is not allowed in a plan file'],
    ['constructor', DEMO_TEXT.replace('"spacer": {', '"spacer": {"constructor": {"prototype": {"polluted": true}},'), 'spacer.constructor: this key is not allowed in a plan file'],
    ['prototype', DEMO_TEXT.replace('"targets": {', '"targets": {"prototype": 1,'), 'targets.prototype: this key is not allowed in a plan file'],
  ];
  it.each(cases)('%s is refused and pollutes nothing', (_name, text, expected) => {
    const errors = errorsOf(text);
    expect(errors).toContain(expected);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(Object.prototype).not.toHaveProperty('polluted');
  });
});

describe('versions and migrations', () => {
  it('version 2 is current and version 1 files are read through one step', () => {
    expect(CURRENT_PLAN_VERSION).toBe(2);
    expect(Object.keys(PLAN_MIGRATIONS)).toEqual(['1']);
  });

  it('migratePlan applies the steps in order and numbers each result', () => {
    const steps = {
      1: (p: Record<string, unknown>) => ({ ...p, renamed: p.old, old: undefined }),
      2: (p: Record<string, unknown>) => ({ ...p, added: true }),
    };
    const result = migratePlan({ version: 1, old: 'x' }, 1, steps, 3);
    expect(result).toEqual({ ok: true, plan: { version: 3, renamed: 'x', old: undefined, added: true }, notes: [{ fromVersion: 1, changes: [] }, { fromVersion: 2, changes: [] }] });
  });

  it('migratePlan names a missing step', () => {
    expect(migratePlan({ version: 1 }, 1, {}, 2)).toEqual({ ok: false, errors: ['version: no way to read version 1 files (this Sekundo reads version 2)'] });
  });

  it('a current file passes through migratePlan untouched', () => {
    const raw = demoJson();
    expect(migratePlan(raw, CURRENT_PLAN_VERSION)).toEqual({ ok: true, plan: raw, notes: [] });
  });

  it('a file from a future version is refused with a clear message', () => {
    expect(errorsAfter((p) => (p.version = CURRENT_PLAN_VERSION + 5))).toEqual([
      `version: this file is version ${CURRENT_PLAN_VERSION + 5}, written by a newer Sekundo; this one reads versions 1–2 (reload the page to get the newer app)`,
    ]);
  });
});

describe('planFileToInput: what the user chose, as the kernel wants it', () => {
  it('turns a vapour-pressure reading into T90: 1638.2 Pa ≈ 1.800 K (ITS-90)', () => {
    // The ITS-90 table quotes 1.800 K to the mK: half a unit in the last digit.
    const ITS90_TOLERANCE_K = 0.0005;
    const plan = loaded(DEMO_TEXT);
    const bath = planBath(plan);
    expect(bath.vapourPressure_Pa).toBe(1638.2);
    expect(bath.scale).toBe('ITS-90');
    expect(Math.abs(bath.temperature_K - 1.8)).toBeLessThanOrEqual(ITS90_TOLERANCE_K); // ITS90
    expect(planFileToInput(plan).temperature_K).toBe(bath.temperature_K);
    expect(ITS90).toContain('1.800 K');
  });

  it('labels a reading below 1.25 K as the reference spline, not ITS-90', () => {
    const plan = loaded(JSON.stringify({ ...demoJson(), bath: { vapourPressure_Pa: 30, liquidDepth_m: 0.1 } }));
    expect(planBath(plan).scale).toBe('reference spline (not ITS-90)');
  });

  it('takes a temperature as given', () => {
    const plan = loaded(JSON.stringify({ ...demoJson(), bath: { temperature_K: 1.65, liquidDepth_m: 0.1 } }));
    expect(planBath(plan)).toEqual({ temperature_K: 1.65, vapourPressure_Pa: null, scale: null });
  });

  it(`turns flux into power: 0.1 W/cm² on 10 mm × 10 mm is 0.1 W (${SI_AREA})`, () => {
    const input = planFileToInput(loaded(DEMO_TEXT));
    expect(input.heater.area_m2).toBeCloseTo(1e-4, 18);
    expect(input.heater.geometry).toBe('rectangle');
    expect([input.heater.width_m, input.heater.height_m]).toEqual([0.01, 0.01]);
    expect(input.heater.power_W).toBeCloseTo(0.1, 15);
    expect(computePlan(input).heater.flux_W_m2).toBeCloseTo(1000, 9);
  });

  it('for a disk, flux × πr² is the power and πr² the area', () => {
    const heater = { ...at(demoJson()).heater, geometry: 'disk', radius_m: 0.005, width_m: undefined, height_m: undefined };
    const input = planFileToInput(loaded(JSON.stringify({ ...demoJson(), heater })));
    const area = Math.PI * 0.005 ** 2;
    expect(input.heater.radius_m).toBe(0.005);
    expect(input.heater.area_m2).toBeCloseTo(area, 18);
    expect(input.heater.power_W).toBeCloseTo(1000 * area, 15);
  });

  it('passes a power as given', () => {
    const heater = { ...at(demoJson()).heater, power_W: 0.25, flux_W_m2: undefined };
    expect(planFileToInput(loaded(JSON.stringify({ ...demoJson(), heater }))).heater.power_W).toBe(0.25);
  });

  it('puts an on-axis distance at [0, 0, d] and keeps an xyz position', () => {
    const input = planFileToInput(loaded(DEMO_TEXT));
    expect(input.sensors.map((s) => s.position_m)).toEqual([
      [0, 0, 0.01],
      [0, 0, 0.025],
      [0.006, 0, 0.035],
      [0, 0, 0.05],
    ]);
  });

  it('maps the pulse shapes to the kernel’s', () => {
    const withShape = (shape: unknown, extra: Record<string, unknown> = {}) =>
      planFileToInput(loaded(JSON.stringify({ ...demoJson(), heater: { ...at(demoJson()).heater, shape, ...extra } }))).heater;
    expect(withShape('rectangle').shape).toEqual({ kind: 'rectangle' });
    expect(withShape('half-sine', { riseTime_s: undefined }).shape).toEqual({ kind: 'half-sine' });
    const custom = withShape({ custom: [[0, 0], [2e-5, 1], [8e-5, 0]] }, { width_s: undefined, riseTime_s: undefined });
    expect(custom.shape).toEqual({ kind: 'custom', points: [[0, 0], [2e-5, 1], [8e-5, 0]] });
    expect(custom.width_s).toBe(8e-5);
  });

  it(`contracts distances measured warm: path = d·(1 − 0.003) for stainless 304 (${CONTRACTION})`, () => {
    // Both sides are the same few multiplications: agreement to rounding.
    const ROUNDING_M = 1e-15;
    expect(SPACER_MATERIALS.find((m) => m.id === 'stainless-304')?.contraction).toBe(0.003);
    const result = computePlan(planFileToInput(loaded(DEMO_TEXT)));
    // On the axis the shortest path is z; the off-axis sensor at x = 6 mm is 1 mm beyond the face's
    // 5 mm half-width (the face itself is not shrunk), so its path runs from the face's edge.
    const s = 1 - 0.003;
    const expected = [0.01 * s, 0.025 * s, Math.hypot(0.035 * s, 0.006 * s - 0.005), 0.05 * s];
    result.sensors.forEach((sensor, i) => {
      expect(Math.abs(sensor.pathLength_m - (expected[i] as number))).toBeLessThanOrEqual(ROUNDING_M);
    });
  });

  it('leaves distances measured cold as they are', () => {
    const plan = loaded(JSON.stringify({ ...demoJson(), spacer: { materialId: 'stainless-304', measuredWarm: false } }));
    const paths = computePlan(planFileToInput(plan)).sensors.map((s) => s.pathLength_m);
    expect(paths).toEqual([0.01, 0.025, Math.hypot(0.035, 0.006 - 0.005), 0.05]);
  });
});

describe('explainPlanError: kernel errors as readable messages', () => {
  const cases: readonly [name: string, error: unknown, expected: string][] = [
    ['pulse width', new OutOfRangeError('pulse width', 20, 1e-8, 10, 's'), 'heater.width_s: pulse width 20 s is outside the valid range 1e-8–10 s'],
    ['rise time', new OutOfRangeError('rise time', 1, 1e-10, 1e-4, 's', 'above 0 and at most the pulse width'), 'heater.riseTime_s: rise time 1 s is outside'],
    ['sensor noise', new OutOfRangeError('sensor 2 (Bolometer B) noise', 0, 1e-15, 10, 'V'), 'sensors[1].noise_V: sensor 2 (Bolometer B) noise 0 V'],
    ['sensor z', new InvalidInputError('sensor 3 (C) z', 'the sensor must sit in front of the heater (z above 0)'), 'sensors[2].position_m: sensor 3 (C) z: the sensor must'],
    ['plane', new OutOfRangeError('reflection of plane 2', 3, -1, 1, ''), 'reflectors[1].reflection: reflection of plane 2 3'],
    ['pulse points', new InvalidInputError('pulse points', 'times must increase'), 'heater.shape.custom: pulse points: times must increase'],
    ['material', new InvalidInputError('spacer material', 'unknown "steel"'), 'spacer.materialId: spacer material: unknown "steel"'],
    ['something else', new InvalidInputError('widget', 'broken'), 'plan: widget: broken'],
    ['not a kernel error', new TypeError('x is undefined'), 'TypeError: x is undefined'],
  ];
  it.each(cases)('%s', (_name, error, expected) => {
    expect(explainPlanError(error)).toContain(expected);
  });

  it('explains an error computePlan really throws', () => {
    const input = planFileToInput(loaded(DEMO_TEXT));
    const broken = { ...input, sensors: input.sensors.map((s, i) => (i === 1 ? { ...s, noise_V: 0 } : s)) };
    let message = '';
    try {
      computePlan(broken);
    } catch (error) {
      message = explainPlanError(error);
    }
    expect(message).toMatch(/^sensors\[1\]\.noise_V: sensor 2 \(Bolometer B, 25 mm\) noise 0 V is outside the valid range/);
  });
});

describe('formatPlanPath', () => {
  it.each([
    [[], 'plan'],
    [['heater', 'width_s'], 'heater.width_s'],
    [['sensors', 2, 'label'], 'sensors[2].label'],
    [['heater', 'shape', 'custom', 3, 0], 'heater.shape.custom[3][0]'],
    [['bath', 'odd key'], 'bath["odd key"]'],
    [['bath', ''], 'bath[""]'],
  ] as const)('%j → %s', (path, expected) => {
    expect(formatPlanPath(path)).toBe(expected);
  });
});
