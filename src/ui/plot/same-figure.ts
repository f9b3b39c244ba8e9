/**
 * Whether two chart figures (plain data: arrays, objects, strings, numbers, booleans, null) hold
 * the same values. A redraw of a large figure takes the page's main thread for a while; a plan
 * edit that changes nothing drawn (a sensor's noise, a label elsewhere) then needs none.
 * Numbers compare with Object.is (NaN equals NaN; 0 and −0 differ, as a drawing may).
 */
export function sameFigure(a: unknown, b: unknown): boolean {
  if (Object.is(a, b)) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (Array.isArray(a)) {
    if (!Array.isArray(b) || a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (!sameFigure(a[i], b[i])) return false;
    return true;
  }
  if (Array.isArray(b) || Object.getPrototypeOf(a) !== Object.getPrototypeOf(b)) return false;
  const keysA = Object.keys(a);
  if (keysA.length !== Object.keys(b).length) return false;
  for (const key of keysA) {
    if (!Object.hasOwn(b, key) || !sameFigure((a as Record<string, unknown>)[key], (b as Record<string, unknown>)[key])) return false;
  }
  return true;
}
