/**
 * The version printed by `sekundo --version`: package.json's "version" field, read when the
 * module loads (the CLI bundle carries it in, so the bundle needs no file beside it).
 */
import packageJson from '../../package.json' with { type: 'json' };

/** The "version" field of package.json. Throws if it is not a string. */
export function packageVersion(): string {
  const version: unknown = packageJson.version;
  if (typeof version === 'string') return version;
  throw new Error('package.json has no "version" string');
}
