import { secondSoundValueUnchecked } from './second-sound';

/*
 * The minimum (near 1.12 K) and maximum (near 1.65 K) of u2 on this kernel's curve, found once by
 * golden-section search. Published: about 18.3 m/s near 1.12 K and 20.36 m/s near 1.65 K
 * (Donnelly & Barenghi 1998, Table 4.1; Wang, Wagner & Donnelly, JLTP 68, 409 (1987)).
 */

export interface SpeedExtremum {
  temperature_K: number;
  speed_m_s: number;
}

function goldenSection(f: (x: number) => number, a: number, b: number): number {
  const g = (Math.sqrt(5) - 1) / 2;
  let lo = a;
  let hi = b;
  for (let i = 0; i < 80; i++) {
    const x1 = hi - g * (hi - lo);
    const x2 = lo + g * (hi - lo);
    if (f(x1) < f(x2)) hi = x2;
    else lo = x1;
  }
  return (lo + hi) / 2;
}

const T_MIN = goldenSection(secondSoundValueUnchecked, 1.0, 1.3);
const T_MAX = goldenSection((T) => -secondSoundValueUnchecked(T), 1.5, 1.8);

/** The two extrema of u2 between 0.55 K and Tλ. */
export const SECOND_SOUND_EXTREMA: { minimum: SpeedExtremum; maximum: SpeedExtremum } = {
  minimum: { temperature_K: T_MIN, speed_m_s: secondSoundValueUnchecked(T_MIN) },
  maximum: { temperature_K: T_MAX, speed_m_s: secondSoundValueUnchecked(T_MAX) },
};
