/**
 * Share links: a plan compressed into the URL fragment, so it never reaches a server (the
 * fragment is not sent with requests). Format of our own: `#plan=1.<data>`, where 1 is this
 * encoding's version and <data> is the plan file's JSON compressed with lz-string's URI-safe
 * alphabet. Decoding validates the plan file exactly as an imported file is validated.
 */
import { compressToEncodedURIComponent, decompressFromEncodedURIComponent } from 'lz-string';
import { type PlanFile, parsePlanFile, serializePlanFile } from './plan-file';

const FRAGMENT_KEY = 'plan=';
const ENCODING_VERSION = '1';
/** Longest fragment read, characters: far more than any plan needs, well under browser URL limits. */
export const MAX_SHARE_FRAGMENT_CHARS = 200_000;
const URI_SAFE = /^[A-Za-z0-9+\-$]*$/;

export type ShareDecode = { ok: true; plan: PlanFile } | { ok: false; errors: string[] } | { ok: 'none' };

/** The fragment (with the leading '#') that carries this plan. */
export function encodeShareFragment(plan: PlanFile): string {
  return `#${FRAGMENT_KEY}${ENCODING_VERSION}.${compressToEncodedURIComponent(serializePlanFile(plan))}`;
}

/**
 * Reads a URL fragment. `{ok: 'none'}` when it carries no plan at all (an empty fragment or one
 * that is not ours); `{ok: false}` with messages when it claims to carry one but it is damaged,
 * truncated, of another version, or not a valid plan.
 */
export function decodeShareFragment(hash: string): ShareDecode {
  const fragment = hash.startsWith('#') ? hash.slice(1) : hash;
  if (!fragment.startsWith(FRAGMENT_KEY)) return { ok: 'none' };
  if (fragment.length > MAX_SHARE_FRAGMENT_CHARS) {
    return { ok: false, errors: [`link: the plan in it is ${fragment.length} characters long, more than the ${MAX_SHARE_FRAGMENT_CHARS} read`] };
  }
  const body = fragment.slice(FRAGMENT_KEY.length);
  const dot = body.indexOf('.');
  const version = dot < 0 ? '' : body.slice(0, dot);
  if (version !== ENCODING_VERSION) {
    return { ok: false, errors: [`link: made with a plan-link version ("${version.slice(0, 12)}") this Sekundo does not read; it reads version ${ENCODING_VERSION}`] };
  }
  const data = body.slice(dot + 1);
  if (!URI_SAFE.test(data)) return { ok: false, errors: ['link: the plan data holds characters a Sekundo link never has; it was changed or is not ours'] };
  let text: string | null;
  try {
    text = decompressFromEncodedURIComponent(data);
  } catch {
    text = null;
  }
  if (!text) return { ok: false, errors: ['link: the plan data is damaged or cut short (was the link copied whole?)'] };
  const parsed = parsePlanFile(text);
  if (!parsed.ok) return { ok: false, errors: parsed.errors.map((e) => `link: ${e}`) };
  return { ok: true, plan: parsed.plan };
}
