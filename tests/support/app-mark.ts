/*
 * Sekundo's mark as an SVG file: a square heater pulse and its delayed, rounded second-sound copy
 * on an ink tile (the header draws the same paths in src/ui/layout/AppHeader.tsx). Used by
 * make-app-icons.ts and by the test that checks the icons in public/ are what it makes.
 */

const INK = '#10223a';
const HEATER = '#f0a04b';
const ARRIVAL = '#3fc1b5';

/** The mark on a 40 × 40 grid; `inset` shrinks it towards the centre (maskable safe zone). */
export function markSvg(options: { tile: 'rounded' | 'full'; inset: number }): string {
  const tile = options.tile === 'full' ? `<rect width="40" height="40" fill="${INK}"/>` : `<rect x="1" y="1" width="38" height="38" rx="9" fill="${INK}"/>`;
  const s = 1 - 2 * options.inset;
  const move = 20 * (1 - s);
  const stroke = 'fill="none" stroke-width="2.6" stroke-linejoin="round" stroke-linecap="round"';
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 40 40">${tile}<g transform="translate(${move} ${move}) scale(${s})"><path d="M4.5 28H8.5V12H13.5V28H16" ${stroke} stroke="${HEATER}"/><path d="M16 28H20C23.2 28 23.6 18.5 27.25 18.5S31.3 28 34.5 28H35.5" ${stroke} stroke="${ARRIVAL}"/></g></svg>\n`;
}

