/**
 * Results of the source-location view, derived from its inputs with the kernel: the speed, the
 * located source (or why there is none) and each sensor's outcome. Nothing here is stored.
 */
import { arrivalsOf, type SensorOutcome, sensorOutcomes } from '../../io/locate-csv';
import { type LocateResult, locateSource, PhysicsError, secondSound, type SpeedPrior, speedPriorAt, type SurfaceConstraint, T_LAMBDA_K } from '../../physics';
import { constraintOf, type LocateOptionsInput, type LocateRowInput } from './locate-inputs';

/** The speed in use and where it came from. */
export type SpeedChoice = { ok: true; speed_m_s: number; from: string } | { ok: false; message: string };

/** Smallest speed the kernel takes, m/s. */
const MIN_SPEED_M_S = 1e-3;

/** u₂ at the bath temperature, or the speed given. */
export function speedOf(o: LocateOptionsInput): SpeedChoice {
  if (o.speedMode === 'speed') return { ok: true, speed_m_s: o.speed_m_s, from: 'the speed given' };
  try {
    const u2 = secondSound(o.temperature_K);
    if (!(u2 >= MIN_SPEED_M_S)) {
      return { ok: false, message: `u₂ is ${u2.toPrecision(2)} m/s at ${o.temperature_K} K, too slow to locate a source; choose a bath temperature further below Tλ = ${T_LAMBDA_K} K.` };
    }
    return { ok: true, speed_m_s: u2, from: `u₂ at ${o.temperature_K.toFixed(3)} K` };
  } catch (error) {
    if (error instanceof PhysicsError) return { ok: false, message: error.message };
    throw error;
  }
}

/** The speed prior the options ask for (u₂ at the bath temperature, its sd), or null. */
export function priorOf(o: LocateOptionsInput): SpeedPrior | null {
  if (o.speedMode !== 'temperature' || !o.speedPrior || o.fitSpeed) return null;
  try {
    return speedPriorAt(o.temperature_K, o.temperatureSd_K);
  } catch (error) {
    if (error instanceof PhysicsError) return null;
    throw error;
  }
}

/** Unknowns of the fit: position coordinates (3, or 2 on a surface), t0, and the speed when fitted. */
export function unknownsOf(constraint: SurfaceConstraint, fitSpeed: boolean): { count: number; words: string } {
  const onSurface = constraint.kind !== 'none';
  const count = (onSurface ? 2 : 3) + 1 + (fitSpeed ? 1 : 0);
  const position = onSurface ? `2 coordinates on the ${constraint.kind}` : 'x, y, z';
  return { count, words: `${position}, the emission time${fitSpeed ? ', the speed' : ''}` };
}

export type LocateOutcome =
  | {
      ok: true;
      result: LocateResult;
      /** Row index of each sensor the kernel saw (those with an arrival). */
      indices: number[];
      outcomes: SensorOutcome[];
      speed: { speed_m_s: number; from: string };
      constraint: SurfaceConstraint;
    }
  | {
      ok: false;
      /** Why there is no result, as a sentence. */
      message: string;
      speed: SpeedChoice;
      constraint: SurfaceConstraint;
    };

/** Locates the source from the rows with an arrival; never throws for bad combinations of inputs. */
export function deriveLocate(rows: readonly LocateRowInput[], options: LocateOptionsInput): LocateOutcome {
  const constraint = constraintOf(options);
  const speed = speedOf(options);
  if (!speed.ok) return { ok: false, message: speed.message, speed, constraint };
  const { arrivals, indices } = arrivalsOf(rows);
  const unknowns = unknownsOf(constraint, options.fitSpeed);
  if (arrivals.length < unknowns.count + 1) {
    const blank = rows.length - arrivals.length;
    return {
      ok: false,
      message:
        `${arrivals.length} sensor${arrivals.length === 1 ? ' has' : 's have'} an arrival time${blank > 0 ? ` (${blank} without)` : ''}; ` +
        `fitting ${unknowns.count} unknowns (${unknowns.words}) with a check needs at least ${unknowns.count + 1}.`,
      speed,
      constraint,
    };
  }
  try {
    const result = locateSource(arrivals, {
      speed_m_s: speed.speed_m_s,
      fitSpeed: options.fitSpeed,
      arrivalSd_s: options.arrivalSd_s,
      constraint,
      dropOutliers: options.dropOutliers,
      speedPrior: priorOf(options),
    });
    return { ok: true, result, indices, outcomes: sensorOutcomes(rows, indices, result), speed, constraint };
  } catch (error) {
    if (error instanceof PhysicsError) return { ok: false, message: error.message, speed, constraint };
    throw error;
  }
}
