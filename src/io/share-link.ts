/**
 * Share links: a plan compressed into the URL fragment, so it never reaches a server (the
 * fragment is not sent with requests). Format of our own: `#plan=1.<data>`, where 1 is this
 * encoding's version and <data> is the plan file's JSON compressed with lz-string's URI-safe
 * alphabet. Decoding stops at the size caps (the link's length, then the unpacked plan's, checked
 * while unpacking: src/io/lz-bounded.ts) and validates the plan file exactly as an imported file is.
 */
import { compressToEncodedURIComponent } from 'lz-string';
import { decompressUriSafeBounded } from './lz-bounded';
import { MAX_PLAN_FILE_CHARS, type PlanFile, parsePlanFile, serializePlanFile } from './plan-file';

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
    return { ok: false, errors: [`link: too large: it is ${fragment.length} characters long, more than the ${MAX_SHARE_FRAGMENT_CHARS} a plan link may have, so it was not read`] };
  }
  const body = fragment.slice(FRAGMENT_KEY.length);
  const dot = body.indexOf('.');
  const version = dot < 0 ? '' : body.slice(0, dot);
  if (version !== ENCODING_VERSION) {
    return { ok: false, errors: [`link: made with a plan-link version ("${version.slice(0, 12)}") this Sekundo does not read; it reads version ${ENCODING_VERSION}`] };
  }
  const data = body.slice(dot + 1);
  if (!URI_SAFE.test(data)) return { ok: false, errors: ['link: the plan data holds characters a Sekundo link never has; it was changed or is not ours'] };
  const unpacked = decompressUriSafeBounded(data, MAX_PLAN_FILE_CHARS);
  if (!unpacked.ok && unpacked.reason === 'too-large') {
    return { ok: false, errors: [`link: too large: the plan in it unpacks to more than the ${MAX_PLAN_FILE_CHARS} characters a plan file may have, so it was not read`] };
  }
  if (!unpacked.ok || unpacked.text === '') return { ok: false, errors: ['link: the plan data is damaged or cut short (was the link copied whole?)'] };
  const parsed = parsePlanFile(unpacked.text);
  if (!parsed.ok) return { ok: false, errors: parsed.errors.map((e) => `link: ${e}`) };
  return { ok: true, plan: parsed.plan };
}
