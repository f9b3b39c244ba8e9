/**
 * A speed far below any second sound a bath can carry is refused before it becomes a temperature.
 * Second sound slows to zero at Tλ, so the kernel inverts any small speed into a temperature a
 * hair below Tλ; but gravity alone spreads Tλ over a bath (the lambda point falls by about
 * 1.3 µK per cm of depth; from memory), and bath regulation rarely holds 1 µK, so a speed below
 * u₂ at 1 µK under Tλ (about 0.19 m/s, from the kernel's own curve) is taken as a mistaken unit —
 * a delay in s given for ms, a column of sample numbers — rather than a reading. Common practice,
 * no source, for the cut itself.
 */
import { secondSound, T_LAMBDA_K } from '../physics';

/** How far under Tλ the slowest speed accepted lies, K. */
export const SLOWEST_READING_BELOW_LAMBDA_K = 1e-6;
/** The slowest speed turned into a temperature, m/s: u₂ at Tλ − 1 µK. */
export const SLOWEST_READING_SPEED_M_S = secondSound(T_LAMBDA_K - SLOWEST_READING_BELOW_LAMBDA_K);

/** Why `speed_m_s` is no second-sound reading, or null when it may be one. */
export function tooSlowForSecondSound(speed_m_s: number): string | null {
  if (!(speed_m_s < SLOWEST_READING_SPEED_M_S) || !(speed_m_s > 0)) return null;
  const shown = Number(speed_m_s.toPrecision(3));
  return (
    `a speed of ${shown} m/s is far slower than any second sound a bath can carry ` +
    `(${Number(SLOWEST_READING_SPEED_M_S.toPrecision(2))} m/s already lies within 1 µK of Tλ); ` +
    'check the unit of the delay and of the distance, and that the time column is time, not sample numbers'
  );
}
