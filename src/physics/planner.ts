import { STANDARD_GRAVITY_M_S2 } from './constants';
import { spacerMaterial } from './contraction';
import { strongHeatingFlux } from './gorter-mellink';
import { nearestEdge_m, planeWaveRange_m } from './heater-face';
import { imageSources } from './image-sources';
import { coldPlanes, coldPosition, planeBetween, planesThroughHeater } from './plan-geometry';
import { checkPlanInput, heaterArea_m2, heaterFace, type PlanInput } from './plan-input';
import type { HeaterPlanResult, PlanePlanResult, PlanResult, PlanWarning } from './plan-result';
import { bathWarnings, fmt, geometryWarnings, heaterWarnings } from './plan-warnings';
import { heliumProperties } from './properties';
import { pulseProfile } from './pulse-shape';
import type { Medium, SampledSignal } from './received-pulse';
import type { SensorResultCache } from './sensor-cache';
import { sensorResult } from './sensor-plan';
import { wallReflection } from './wall-reflection';

/*
 * The measurement planner: for a proposed heater, sensors, reflectors and digitiser at a bath
 * temperature, when each wave arrives at each sensor, how big the signal is, what overlaps or
 * distorts, and how finely the delay pins the temperature. Physics: PHYSICS notes §2–5. Inputs:
 * plan-input.ts; results: plan-result.ts; warnings and their thresholds: plan-warnings.ts.
 */

/**
 * Computes the plan: arrivals, predicted pulses, echoes, signal and SNR, limits and temperature
 * resolution for every sensor. Inputs in SI (see {@link PlanInput}); throws OutOfRangeError,
 * NonFiniteInputError or InvalidInputError naming the field.
 */
export function computePlan(plan: PlanInput, cache?: SensorResultCache): PlanResult {
  const steps = computePlanSteps(plan, cache);
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
  }
}

/**
 * {@link computePlan} one sensor at a time: the generator yields the number of sensors done after
 * each one and returns the result, so a caller can pause between sensors (the page's worker
 * drops a plan the user has already changed). With a {@link SensorResultCache}, a sensor whose
 * inputs are unchanged since an earlier call is taken from it (same result, same warnings).
 */
export function* computePlanSteps(plan: PlanInput, cache?: SensorResultCache): Generator<number, PlanResult, void> {
  checkPlanInput(plan);
  const T = plan.temperature_K;
  const props = heliumProperties(T);
  const h = plan.heater;
  const profile = pulseProfile(h.shape, h.width_s, h.riseTime_s);
  const flux = h.power_W / heaterArea_m2(h);
  const face = heaterFace(h);
  const warnings: PlanWarning[] = [];
  const headPressure = props.density_kg_m3 * STANDARD_GRAVITY_M_S2 * plan.liquidDepth_m;
  const averagePower = h.power_W * profile.area_s * h.repetitionRate_Hz;
  const material = spacerMaterial(plan.spacer.materialId);
  const warm = plan.spacer.measuredWarm;
  const scale = warm ? 1 - material.contraction : 1;
  const record = {
    start_s: -plan.digitiser.preTrigger_s,
    end_s: plan.digitiser.recordLength_s - plan.digitiser.preTrigger_s,
    sampleInterval_s: 1 / plan.digitiser.sampleRate_Hz,
  };
  bathWarnings(warnings, plan, props, { averagePower, profile, headPressure });

  const u2 = props.secondSound_m_s;
  let medium: Medium | null = null;
  const heater: HeaterPlanResult = {
    flux_W_m2: flux,
    power_W: h.power_W,
    energyPerPulse_J: h.power_W * profile.area_s,
    averagePower_W: averagePower,
    faceDeltaT_K: null,
    counterflowVelocity_m_s: null,
    shockDistance_m: null,
    shockEdge: null,
    effectiveRise_s: profile.effectiveRise_s,
    duration_s: profile.duration_s,
    planeWaveRange_m: null,
    planeWaveEdge_m: face ? nearestEdge_m(face) : null,
    strongHeatingFlux_W_m2: null,
    wallImpedance_W_m2K: null,
    kapitzaConductance_W_m2K: null,
    wallReflection: null,
  };
  let wall: { reflection: number; note: string } | null = null;
  if (u2 !== null && props.nonlinearity_per_K !== null) {
    medium = { density_kg_m3: props.density_kg_m3, specificHeat_J_kgK: props.specificHeat_J_kgK, secondSound_m_s: u2 };
    const Z = props.density_kg_m3 * props.specificHeat_J_kgK * u2;
    const faceDeltaT = flux / Z;
    const rhoS = props.superfluidFraction * props.density_kg_m3;
    const counterflow = flux / (rhoS * props.entropy_J_kgK * T);
    const alpha = props.nonlinearity_per_K;
    const strongLimit = strongHeatingFlux(T, profile.duration_s);
    const r = wallReflection(T, Z);
    wall = {
      reflection: r.reflection,
      note: `solid wall, R = (Z − h)/(Z + h) = ${r.reflection.toFixed(4)} with Z = ρ c_p u₂ = ${fmt(Z / 1e6)} MW/(m²·K) and a Kapitza conductance h ≈ ${fmt(r.conductance_W_m2K / 1e3, 2)} kW/(m²·K) (order of magnitude, ∝ T³; Pollack 1969)`,
    };
    Object.assign(heater, {
      faceDeltaT_K: faceDeltaT,
      counterflowVelocity_m_s: counterflow,
      shockDistance_m: alpha !== 0 ? (u2 * profile.effectiveRise_s) / (Math.abs(alpha) * faceDeltaT) : Number.POSITIVE_INFINITY,
      shockEdge: alpha > 0 ? 'leading' : 'trailing',
      planeWaveRange_m: face ? planeWaveRange_m(face, u2, profile.duration_s) : null,
      strongHeatingFlux_W_m2: strongLimit,
      wallImpedance_W_m2K: Z,
      kapitzaConductance_W_m2K: r.conductance_W_m2K,
      wallReflection: r.reflection,
    } satisfies Partial<HeaterPlanResult>);
    heaterWarnings(warnings, plan, { flux, duration_s: profile.duration_s, strongLimit, counterflow, u2 });
  }

  const planes: PlanePlanResult[] = coldPlanes(plan, scale, wall);
  const throughHeater = planesThroughHeater(h, planes);
  const positions = plan.sensors.map((s) => coldPosition(s, scale));
  const behind = new Map<string, PlanePlanResult>();
  plan.sensors.forEach((s, i) => {
    const plane = planeBetween(positions[i] as (typeof positions)[number], planes);
    if (plane) behind.set(s.id, plane);
  });
  geometryWarnings(warnings, plan, { behind, throughHeater });

  const images = imageSources(
    [0, 0, 0],
    (h.geometry === 'plane-wave' ? planes.filter((p) => p.axis === 'z') : planes).map((p) => ({ label: p.label, axis: p.axis, position_m: p.position_m, reflection: p.reflection })),
    // One order more than asked: a reflector through the sensor adds its partner to the last echo.
    plan.echoOrder + 1,
  );
  // Everything a sensor's result depends on besides the sensor itself (see SensorResultCache).
  const known = cache?.context(JSON.stringify({ ...plan, sensors: null }));
  const sensors = [];
  for (const [i, sensor] of plan.sensors.entries()) {
    const blocked = behind.has(sensor.id) || throughHeater.length > 0;
    const key = known ? `${blocked}|${JSON.stringify(sensor)}` : '';
    const kept = known?.get(key);
    if (kept && cache) {
      cache.hits += 1;
      sensors.push(kept.result);
      warnings.push(...kept.warnings);
      yield i + 1;
      continue;
    }
    const measuredLength = Math.hypot(...sensor.position_m);
    const pathSd = Math.hypot(sensor.distanceSd_m * scale, warm ? measuredLength * material.contractionSd : 0);
    const own: PlanWarning[] = [];
    const result = sensorResult({
      plan,
      sensor,
      position: positions[i] as (typeof positions)[number],
      pathSd,
      props,
      medium,
      profile,
      flux,
      face,
      images,
      planes,
      warnings: own,
      faceDeltaT: heater.faceDeltaT_K,
      shockDistance: heater.shockDistance_m,
      blocked,
    });
    if (known && cache) {
      cache.misses += 1;
      known.set(key, { result, warnings: own });
    }
    sensors.push(result);
    warnings.push(...own);
    yield i + 1;
  }

  const heaterStep = Math.max(profile.duration_s / 400, 1e-12);
  const heaterPulse: SampledSignal = {
    start_s: -heaterStep * 10,
    step_s: heaterStep,
    values: Float64Array.from({ length: 421 }, (_, i) => profile.value((i - 10) * heaterStep)),
  };

  return { temperature_K: T, properties: props, heater, heaterPulse, planes, sensors, warnings, record, headPressure_Pa: headPressure };
}
