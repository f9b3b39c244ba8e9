import { spawnSync } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { type FlagSpec, parseFlags } from '../../src/cli/args';
import { loadAllCommands } from '../../src/cli/commands/index';
import { main } from '../../src/cli/main';
import { heliumProperties } from '../../src/physics';
import type { CliIo } from '../../src/cli/io';
import { expectUsageError, type Run, run, runJson as runJsonAs } from '../support/cli-harness';

const COMMANDS = await loadAllCommands();

const REPO_ROOT = fileURLToPath(new URL('../..', import.meta.url));
const PACKAGE_VERSION: unknown = JSON.parse(readFileSync(join(REPO_ROOT, 'package.json'), 'utf8')).version;

// Sources of the numbers below.
const DB1998 = 'Donnelly & Barenghi 1998, second-sound representation';
const ITS90 = 'ITS-90 helium-4 vapour-pressure equations';
const ITS90_NBP = 'ITS-90: normal boiling point of helium-4, 4.2221 K at 101325 Pa';
const REGRESSION = 'value of this kernel, regression';

/** The fields `props --json` promises to scripts (the kernel adds a few more, also passed through). */
const PROPS_FIELDS = [
  'temperature_K',
  'phase',
  'secondSound_m_s',
  'secondSoundSlope_m_s_K',
  'secondSoundSd_m_s',
  'firstSound_m_s',
  'density_kg_m3',
  'superfluidFraction',
  'normalFraction',
  'entropy_J_kgK',
  'specificHeat_J_kgK',
  'nonlinearity_per_K',
  'vapourPressure_Pa',
  'model',
] as const;



const runJson = (...argv: string[]) => runJsonAs<Record<string, unknown>>(...argv);

function numberField(object: Record<string, unknown>, key: string): number {
  const value = object[key];
  if (typeof value !== 'number') throw new Error(`${key} is not a number: ${String(value)}`);
  return value;
}


/**
 * Reference values: [argv (before --json), field, expected, tolerance, source]. Each tolerance is
 * half a unit in the last digit the expectation is quoted to, except the normal boiling point,
 * which ITS-90 fixes to ±0.0001 K.
 */
const REFERENCE: readonly [argv: readonly string[], field: string, expected: number, tolerance: number, source: string][] = [
  [['props', '--temperature', '1.8K'], 'secondSound_m_s', 19.9, 0.005, DB1998],
  [['props', '--temperature', '1.8K'], 'vapourPressure_Pa', 1638.2, 0.05, ITS90],
  [['vapour', '--pressure', '1638Pa'], 'temperature_K', 1.8, 0.0005, ITS90],
  [['vapour', '--pressure', '1atm'], 'temperature_K', 4.2221, 0.0001, ITS90_NBP],
  [['vapour', '--temperature', '1.8K'], 'pressure_Pa', 1638.2, 0.05, ITS90],
  [['vapour', '--temperature', '1.1K'], 'pressure_Pa', 38.009, 0.0005, REGRESSION],
];

describe('reference values through the command line', () => {
  it.each(REFERENCE)('%j gives %s = %s ± %s (%s)', async (argv, field, expected, tolerance) => {
    const json = await runJson(...argv);
    expect(Math.abs(numberField(json, field) - expected)).toBeLessThanOrEqual(tolerance);
  });
});

describe('sekundo props --json', () => {
  it('prints one JSON object with every promised field', async () => {
    const json = await runJson('props', '--temperature', '1.8K');
    for (const key of PROPS_FIELDS) expect(json).toHaveProperty(key);
  });

  it('passes every field of heliumProperties through unchanged', async () => {
    expect(await runJson('props', '--temperature', '1.8K')).toEqual(heliumProperties(1.8));
  });

  it('at 1.8 K reports He II, the measured u₂ and the ITS-90 vapour pressure', async () => {
    const json = await runJson('props', '--temperature', '1.8K');
    expect(json.phase).toBe('He II');
    expect(json.model).toBe('measured');
    expect(json.vapourPressureScale).toBe('ITS-90');
  });

  it('reads 1.8K, "1.8 K", 1800mK, 1.8 and --temperature=1.8K alike', async () => {
    const reference = await run('props', '--temperature', '1.8K', '--json');
    for (const argv of [
      ['props', '--temperature', '1.8 K', '--json'],
      ['props', '--temperature', '1800mK', '--json'],
      ['props', '--temperature', '1.8', '--json'],
      ['props', '--temperature=1.8K', '--json'],
      ['props', '--json', '--temperature', '1.8K'],
    ]) {
      expect(await run(...argv)).toEqual(reference);
    }
  });

  it('above Tλ reports He I and null second sound', async () => {
    const json = await runJson('props', '--temperature', '2.5K');
    expect(json.phase).toBe('He I');
    expect(json.secondSound_m_s).toBeNull();
    expect(json.secondSoundSlope_m_s_K).toBeNull();
    expect(json.nonlinearity_per_K).toBeNull();
    expect(json.superfluidFraction).toBe(0);
    expect(typeof json.secondSoundAbsentReason).toBe('string');
  });

  it('below 0.5517 K says the Landau model gives u₂, and p_sat is null below 0.5 K', async () => {
    const json = await runJson('props', '--temperature', '400mK');
    expect(json.model).toBe('Landau model');
    expect(json.vapourPressure_Pa).toBeNull();
  });

  it('accepts both ends of the range, 0.3 K and 4.24 K', async () => {
    expect(numberField(await runJson('props', '--temperature', '0.3K'), 'temperature_K')).toBe(0.3);
    expect(numberField(await runJson('props', '--temperature', '4.24K'), 'temperature_K')).toBe(4.24);
  });
});

describe('sekundo props (table)', () => {
  it('prints an aligned table with symbols, units, mK beside K and the vapour scale', async () => {
    const { status, stdout, stderr } = await run('props', '--temperature', '1.8K');
    expect(status).toBe(0);
    expect(stderr).toBe('');
    expect(stdout).toContain('19.903'); // value of this kernel, regression (DB1998 representation)
    expect(stdout).toContain('1800.00 mK');
    expect(stdout).toContain('u₂');
    expect(stdout).toContain('m/s');
    expect(stdout).toContain('ITS-90');
    expect(stdout).toContain('He II');
    const unitColumns = stdout
      .split('\n')
      .filter((line) => / m\/s\b/.test(line))
      .map((line) => line.indexOf(' m/s') + 1);
    expect(unitColumns.length).toBeGreaterThan(3);
    expect(new Set(unitColumns).size).toBe(1);
  });

  it('explains above Tλ why there is no second sound', async () => {
    const { status, stdout } = await run('props', '--temperature', '2.5K');
    expect(status).toBe(0);
    expect(stdout).toContain('He I');
    expect(stdout).toContain('No second sound');
    expect(stdout).toMatch(/Second sound\s+u₂\s+—/);
  });

  it('explains below 0.5 K why there is no vapour pressure', async () => {
    const { stdout } = await run('props', '--temperature', '0.4K');
    expect(stdout).toContain('No vapour pressure');
    expect(stdout).toContain('Landau model');
  });
});

describe('sekundo vapour', () => {
  it('--pressure 1638Pa answers on the ITS-90 scale with exactly three fields', async () => {
    const json = await runJson('vapour', '--pressure', '1638Pa');
    expect(json.pressure_Pa).toBe(1638);
    expect(json.scale).toBe('ITS-90');
    expect(Object.keys(json).sort()).toEqual(['pressure_Pa', 'scale', 'temperature_K']);
  });

  it('reads 1 atm in every pressure unit alike', async () => {
    const reference = await run('vapour', '--pressure', '101325Pa', '--json');
    for (const p of ['101325', '101.325kPa', '1013.25mbar', '1.01325bar', '760torr', '1atm', '1.01325e5 Pa']) {
      expect(await run('vapour', '--pressure', p, '--json')).toEqual(reference);
    }
  });

  it('labels the reference spline below 1.25 K as not ITS-90', async () => {
    const json = await runJson('vapour', '--temperature', '1.1K');
    expect(json.scale).toBe('reference spline (not ITS-90)');
  });

  it('prints a table with kelvin, millikelvin, pascal, mbar, torr and the scale', async () => {
    const { status, stdout } = await run('vapour', '--pressure', '1638Pa');
    expect(status).toBe(0);
    expect(stdout).toMatch(/1\.79996\s+K\s+1799\.96 mK/); // value of this kernel, regression (ITS-90 at 1638 Pa)
    expect(stdout).toContain('16.380 mbar');
    expect(stdout).toContain('Scale: ITS-90');
  });
});

describe('help and version', () => {
  it.each([['--help'], ['-h'], ['help']])('sekundo %s lists every command, flag, unit and range', async (flag) => {
    const { status, stdout, stderr } = await run(flag);
    expect(status).toBe(0);
    expect(stderr).toBe('');
    for (const command of COMMANDS) {
      expect(stdout).toContain(command.name);
      for (const spec of command.flags) expect(stdout).toContain(`--${spec.name}`);
    }
    for (const unit of ['K, mK', 'Pa, kPa, mbar, bar, torr, atm', 'm, cm, mm, um, µm', 's, ms, us, µs, ns']) {
      expect(stdout).toContain(unit);
    }
    expect(stdout).toContain('0.3–4.24 K');
    expect(stdout).toContain('0.5–5 K');
  });

  it.each(
    COMMANDS.flatMap((c) => [
      [c.name, [c.name, '--help']],
      [c.name, [c.name, '-h']],
      [c.name, ['help', c.name]],
      [c.name, [c.name, '--temperature', 'nonsense', '--help']],
    ]),
  )('%s has its own help: %j', async (name, argv) => {
    const { status, stdout, stderr } = await run(...argv);
    expect(status).toBe(0);
    expect(stderr).toBe('');
    expect(stdout).toContain(`sekundo ${name}`);
    const command = COMMANDS.find((c) => c.name === name);
    for (const spec of command?.flags ?? []) expect(stdout).toContain(`--${spec.name}`);
    expect(stdout).toContain('valid range');
  });

  it('sekundo --version prints the version in package.json', async () => {
    expect(await run('--version')).toEqual({ status: 0, stdout: `${String(PACKAGE_VERSION)}\n`, stderr: '' });
  });
});

describe('bad input: one line on stderr, status 2', () => {
  const cases: readonly [name: string, argv: readonly string[], expected: readonly string[]][] = [
    ['no command', [], ['no command given', 'props', 'vapour']],
    ['unknown command', ['propz'], ['unknown command "propz"', 'props, vapour']],
    ['unknown command after help', ['help', 'propz'], ['unknown command "propz"']],
    ['flag before any command', ['--temperature', '1.8K'], ['unknown flag --temperature']],
    ['extra argument after --version', ['--version', 'x'], ['unexpected argument "x"']],
    ['extra argument after --help', ['--help', 'x'], ['unexpected argument "x"']],
    ['unknown flag', ['props', '--temp', '1.8K'], ['unknown flag --temp', '--temperature']],
    ['unknown flag with a value', ['props', '--temp=1.8K'], ['unknown flag --temp ']],
    ['short unknown flag', ['props', '-t', '1.8K'], ['unknown flag -t']],
    ['missing required flag', ['props'], ['needs --temperature', '0.3–4.24 K']],
    ['missing value at the end', ['props', '--temperature'], ['--temperature needs a value', '0.3–4.24 K']],
    ['missing value before a flag', ['props', '--temperature', '--temperature'], ['--temperature needs a value']],
    ['empty inline value', ['props', '--temperature='], ['--temperature needs a value']],
    ['unknown unit', ['props', '--temperature', '5F'], ['--temperature', 'unknown unit "F"', 'K, mK', '0.3–4.24 K']],
    ['unit of another quantity', ['props', '--temperature', '1.8Pa'], ['unknown unit "Pa"', 'K, mK']],
    ['not a number', ['props', '--temperature', 'warm'], ['--temperature', 'does not start with a number']],
    ['NaN', ['props', '--temperature', 'NaN'], ['--temperature', 'finite', '0.3–4.24 K']],
    ['infinity', ['props', '--temperature', 'Infinity'], ['--temperature', 'finite', '0.3–4.24 K']],
    ['overflow', ['props', '--temperature', '1e999K'], ['--temperature', 'finite', '0.3–4.24 K']],
    ['above range', ['props', '--temperature', '5'], ['--temperature 5 K is outside the valid range 0.3–4.24 K']],
    ['above range, in mK', ['props', '--temperature', '5000mK'], ['--temperature 5000mK (= 5 K) is outside', '0.3–4.24 K']],
    ['just above range', ['props', '--temperature', '4.2401K'], ['--temperature 4.2401 K is outside', '0.3–4.24 K']],
    ['just below range', ['props', '--temperature', '0.2999K'], ['--temperature 0.2999 K is outside', '0.3–4.24 K']],
    ['zero', ['props', '--temperature', '0K'], ['--temperature 0 K is outside', '0.3–4.24 K']],
    ['negative', ['props', '--temperature', '-1.8K'], ['--temperature -1.8 K is outside', '0.3–4.24 K']],
    ['repeated flag', ['props', '--temperature', '1.8K', '--temperature', '1.9K'], ['--temperature is given more than once']],
    ['value for a boolean flag', ['props', '--temperature', '1.8K', '--json=yes'], ['--json takes no value']],
    ['stray argument', ['props', '1.8K'], ['unexpected argument "1.8K"', '--temperature 1.8K']],
    ['unit split from its number', ['props', '--temperature', '1.8', 'K'], ['unexpected argument "K"', 'quote']],
    ['vapour with neither flag', ['vapour'], ['exactly one of --pressure', '--temperature', 'none was given']],
    ['vapour with both flags', ['vapour', '--pressure', '1638Pa', '--temperature', '1.8K'], ['exactly one', 'not both']],
    ['vapour pressure above range', ['vapour', '--pressure', '2bar'], ['--pressure 2bar (= 200000 Pa) is outside', '196017 Pa', '0.5–5 K']],
    ['vapour pressure negative', ['vapour', '--pressure', '-1Pa'], ['--pressure -1 Pa is outside']],
    ['vapour pressure unit', ['vapour', '--pressure', '12psi'], ['--pressure', 'unknown unit "psi"', 'Pa, kPa, mbar, bar, torr, atm']],
    ['vapour temperature below range', ['vapour', '--temperature', '0.4K'], ['--temperature 0.4 K is outside the valid range 0.5–5 K']],
    ['vapour temperature NaN', ['vapour', '--temperature', 'nan'], ['--temperature', 'finite', '0.5–5 K']],
  ];
  it.each(cases)('%s', async (_name, argv, expected) => {
    const line = expectUsageError(await run(...argv));
    for (const fragment of expected) expect(line).toContain(fragment);
  });
});

describe('internal errors: one line on stderr, status 1', () => {
  it('reports a failure inside a command without a stack trace', async () => {
    let stderr = '';
    const io: CliIo = {
      stdout: () => {
        throw new Error('write failed\n    at somewhere (file.ts:1:1)');
      },
      stderr: (text) => {
        stderr += text;
      },
    };
    expect(await main(['props', '--temperature', '1.8K'], io)).toBe(1);
    expect(stderr).toBe('sekundo: internal error: Error: write failed at somewhere (file.ts:1:1)\n');
  });
});

describe('the command table', () => {
  it('has unique command names and unique flags per command', () => {
    const names = COMMANDS.map((c) => c.name);
    expect(new Set(names).size).toBe(names.length);
    for (const command of COMMANDS) {
      const flags = command.flags.map((f) => f.name);
      expect(new Set(flags).size).toBe(flags.length);
      expect(flags).not.toContain('help');
    }
  });

  it('parses text flags too, for commands that take file names', () => {
    const specs: readonly FlagSpec[] = [
      { kind: 'text', name: 'trace', placeholder: 'file', help: 'a trace file' },
      { kind: 'quantity', name: 'distance', dimension: 'length', placeholder: 'd', range: [0, 1], help: 'path' },
      { kind: 'quantity', name: 'delay', dimension: 'time', placeholder: 't', range: [0, 1], help: 'delay' },
    ];
    const args = parseFlags('fit', ['--trace', 'run-1.csv', '--distance=50mm', '--delay', '2.5 ms'], specs);
    expect(args.text('trace')).toBe('run-1.csv');
    expect(args.quantity('distance')?.value).toBe(0.05);
    expect(args.quantity('delay')?.value).toBe(0.0025);
    expect(args.has('trace')).toBe(true);
    expect(args.flag('trace')).toBe(false);
  });

  it('the command line imports nothing from the UI, React or other UI libraries', () => {
    const cliDir = join(REPO_ROOT, 'src/cli');
    const files = readdirSync(cliDir, { recursive: true, encoding: 'utf8' }).filter((f) => f.endsWith('.ts'));
    const sources = [...files.map((f) => join(cliDir, f)), join(REPO_ROOT, 'src/io/quantity.ts')];
    for (const file of sources) {
      const specifiers = [...readFileSync(file, 'utf8').matchAll(/from '([^']+)'/g)].map((m) => m[1] ?? '');
      for (const specifier of specifiers) {
        expect(specifier, `${file} imports ${specifier}`).toMatch(/^(node:|\.\.?\/)/);
        expect(specifier, `${file} imports ${specifier}`).not.toMatch(/\/(ui|app)(\/|$)/);
      }
    }
  });
});

describe('real processes', () => {
  // Each spawn starts node and compiles the TypeScript through tsx; npx adds its own start-up.
  const SPAWN_TIMEOUT_MS = 60_000;

  function spawn(command: string, argv: readonly string[]): Run {
    const result = spawnSync(command, argv, {
      cwd: REPO_ROOT,
      encoding: 'utf8',
      timeout: SPAWN_TIMEOUT_MS,
      env: { ...process.env, NO_UPDATE_NOTIFIER: '1', npm_config_update_notifier: 'false' },
    });
    return { status: result.status ?? -1, stdout: result.stdout, stderr: result.stderr };
  }

  it(
    'node bin/sekundo.mjs props --temperature 1.8K --json prints every field',
    () => {
      const result = spawn(process.execPath, ['bin/sekundo.mjs', 'props', '--temperature', '1.8K', '--json']);
      expect(result).toMatchObject({ status: 0, stderr: '' });
      const json = JSON.parse(result.stdout) as Record<string, unknown>;
      for (const key of PROPS_FIELDS) expect(json).toHaveProperty(key);
      expect(Math.abs(numberField(json, 'secondSound_m_s') - 19.9)).toBeLessThanOrEqual(0.005); // DB1998
    },
    SPAWN_TIMEOUT_MS,
  );

  it(
    'node bin/sekundo.mjs props --temperature 2.5K --json gives He I and null u₂',
    () => {
      const result = spawn(process.execPath, ['bin/sekundo.mjs', 'props', '--temperature', '2.5K', '--json']);
      expect(result.status).toBe(0);
      const json = JSON.parse(result.stdout) as Record<string, unknown>;
      expect(json.phase).toBe('He I');
      expect(json.secondSound_m_s).toBeNull();
    },
    SPAWN_TIMEOUT_MS,
  );

  it(
    'node bin/sekundo.mjs vapour --pressure 1atm --json gives 4.2221 K',
    () => {
      const result = spawn(process.execPath, ['bin/sekundo.mjs', 'vapour', '--pressure', '1atm', '--json']);
      expect(result.status).toBe(0);
      const json = JSON.parse(result.stdout) as Record<string, unknown>;
      expect(Math.abs(numberField(json, 'temperature_K') - 4.2221)).toBeLessThanOrEqual(0.0001); // ITS-90 NBP
      expect(json.scale).toBe('ITS-90');
    },
    SPAWN_TIMEOUT_MS,
  );

  it(
    'node bin/sekundo.mjs with bad input exits 2 with one stderr line',
    () => {
      const line = expectUsageError(spawn(process.execPath, ['bin/sekundo.mjs', 'props', '--temperature', '5K']));
      expect(line).toBe('sekundo: --temperature 5 K is outside the valid range 0.3–4.24 K');
    },
    SPAWN_TIMEOUT_MS,
  );

  it(
    'npx sekundo props --temperature 1.8K --json works from the repository root',
    () => {
      const result = spawn('npx', ['--no-install', 'sekundo', 'props', '--temperature', '1.8K', '--json']);
      expect(result.status).toBe(0);
      const json = JSON.parse(result.stdout) as Record<string, unknown>;
      for (const key of PROPS_FIELDS) expect(json).toHaveProperty(key);
      expect(Math.abs(numberField(json, 'vapourPressure_Pa') - 1638.2)).toBeLessThan(0.05); // ITS-90
    },
    SPAWN_TIMEOUT_MS,
  );
});
