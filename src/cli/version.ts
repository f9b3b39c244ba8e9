/**
 * The version printed by `sekundo --version`, read from the project's package.json.
 */
import { readFileSync } from 'node:fs';

const PACKAGE_JSON = new URL('../../package.json', import.meta.url);

/** The "version" field of package.json. Throws if the file is missing or has no version. */
export function packageVersion(): string {
  const parsed: unknown = JSON.parse(readFileSync(PACKAGE_JSON, 'utf8'));
  if (typeof parsed === 'object' && parsed !== null && 'version' in parsed && typeof parsed.version === 'string') {
    return parsed.version;
  }
  throw new Error('package.json has no "version" string');
}
