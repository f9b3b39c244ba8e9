/** Speeds of the front the location takes, m/s (wide: an effective speed may be anything sensible). */
export const LOCATE_SPEED_RANGE_M_S = [1e-3, 1e4] as const;
