import { startTransition, useEffect, useId, useMemo, useState } from 'react';
import { SPACER_MATERIALS } from '../../physics';
import { ChartFigure } from '../charts/ChartFigure';
import { PlotlyChart } from '../plot/PlotlyChart';
import { HelpLabel, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { PLAN_OTHER_HELP } from './planner-help';
import { type DisplayUnit, LADDERS, readText, temperatureText } from '../units/ladders';
import { MAP_DISTANCE_RANGE_M, type MapSensor, mapFigure, mapGrid, onMap, spreadAt } from './resolution-map';
import { markMapStart, reportDrawn } from './recompute-timer';
import { usePlanOutcome } from './use-plan';
import { useShownLadders } from '../units/use-shown-ladders';

export const MAP_CHART_ID = 'planner-resolution-map';

/** How long typing must pause before the map follows, ms. */
const MAP_SETTLE_MS = 150;

/**
 * Temperature sd over temperature × distance for one sensor's timing and distance uncertainty.
 * It follows the plan once typing pauses, so a keystroke never waits for the map.
 */
export function ResolutionMap() {
  const outcome = useSettledValue(usePlanOutcome(), MAP_SETTLE_MS);
  const sensorKeys = useSekundoStore((s) => s.plannerSensorKeys);
  const chosenKey = useSekundoStore((s) => s.plannerMapSensorKey);
  const choose = useSekundoStore((s) => s.setPlannerMapSensor);
  const selectId = useId();
  const sensorHelp = useFieldHelp('sensor of the map', PLAN_OTHER_HELP['map.sensor']);
  const ladders = useShownLadders();
  const units = useMemo(() => ({ temperature: ladders.temperature[0] as DisplayUnit, length: ladders.length[0] as DisplayUnit }), [ladders]);
  const index = Math.max(0, chosenKey === null ? 0 : sensorKeys.indexOf(chosenKey));
  const result = outcome.ok ? outcome.result : null;
  const sensor = result?.sensors[index] ?? result?.sensors[0] ?? null;
  const planSensor = outcome.ok ? outcome.input.sensors[index] : undefined;
  const spacer = outcome.ok ? outcome.input.spacer : null;
  const material = SPACER_MATERIALS.find((m) => m.id === spacer?.materialId);
  const measuredWarm = spacer?.measuredWarm ?? false;

  const mapSensor: MapSensor | null = useMemo(() => {
    if (!sensor || sensor.timingSd_s === null || !planSensor) return null;
    const scale = measuredWarm ? 1 - (material?.contraction ?? 0) : 1;
    return {
      timingSd_s: sensor.timingSd_s,
      distanceSd_m: planSensor.distanceSd_m * scale,
      contractionSd: measuredWarm ? (material?.contractionSd ?? 0) / scale : 0,
      lag_s: planSensor.lag_s,
    };
  }, [sensor, planSensor, measuredWarm, material]);

  const T = result?.temperature_K ?? Number.NaN;
  const distance = sensor?.pathLength_m ?? Number.NaN;
  const target = outcome.ok ? outcome.input.targets.temperatureSd_K : 1e-3;
  const figure = useMemo(() => {
    if (!mapSensor) return null;
    const range: [number, number] = [Math.min(MAP_DISTANCE_RANGE_M[0], distance / 1.5), Math.max(MAP_DISTANCE_RANGE_M[1], distance * 1.5)];
    const planned = onMap(T) && sensor ? { temperature_K: T, distance_m: distance, sd_K: spreadAt(T, distance, mapSensor).sd_K, label: sensor.id } : null;
    return { ...mapFigure(mapGrid(mapSensor, range), { planned, target_K: target }, units), planned };
  }, [mapSensor, T, distance, target, sensor, units]);

  if (!result || !sensor) return null;
  const choice = (
    <div className="plan-field map-sensor">
      <HelpLabel htmlFor={selectId} className="plan-field__label" help={sensorHelp}>
Timing and distance sd of
</HelpLabel>
      <select
        id={selectId}
        className="plan-select"
        value={sensorKeys[index] ?? ''}
        aria-describedby={sensorHelp.describedBy}
        onChange={(event) => choose(event.target.value)}
      >
        {result.sensors.map((s, i) => (
          <option key={sensorKeys[i] ?? s.id} value={sensorKeys[i] ?? s.id}>
            {s.label} ({s.id})
          </option>
        ))}
      </select>
    </div>
  );
  if (!mapSensor || !figure) {
    return (
      <ChartFigure id={MAP_CHART_ID} title="Temperature resolution map" caption="No second sound at this bath temperature (He I): time of flight cannot give the temperature.">
        {choice}
      </ChartFigure>
    );
  }
  const sdText = (x: number | null) => (x === null ? '—' : readText(x, LADDERS.temperatureDifference, 2));
  const plannedText = figure.planned
    ? `At the plan (${temperatureText(T, ladders.temperature, 1e-3)}, ${readText(distance, ladders.length, 3)}) the map gives σT ≈ ${sdText(figure.planned.sd_K)} (results table: ${sdText(sensor.temperatureSd_K)}).`
    : `The planned ${temperatureText(T, ladders.temperature, 1e-3)} is outside this map.`;
  return (
    <ChartFigure
      id={MAP_CHART_ID}
      title="Temperature resolution map"
      caption={
        <>
          <span className="caption-values">{plannedText}</span> One reading with {sensor.id}’s timing sd{' '}
          {readText(mapSensor.timingSd_s, LADDERS.time, 2)} and distance sd {readText(mapSensor.distanceSd_m, LADDERS.length, 2)}
          {mapSensor.contractionSd > 0 ? ' plus the spacer’s contraction uncertainty' : ''}. Colour bands: σT; dashed line: the target{' '}
          {sdText(target)} is reached above it. White dotted patches: insensitive, near the u₂ minimum and maximum. Diamond: the plan.
        </>
      }
    >
      {choice}
      <div className="map-box">
        <PlotlyChart
          chartId={MAP_CHART_ID}
          label={`Map of the temperature sd over bath temperature and heater–sensor distance. ${plannedText}`}
          data={figure.data}
          layout={figure.layout}
          onDrawn={() => reportDrawn('map')}
        />
      </div>
    </ChartFigure>
  );
}

/** `value`, but only once it has stayed the same for `delay_ms` (the first value at once). */
function useSettledValue<T>(value: T, delay_ms: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    if (Object.is(value, settled)) return;
    const timer = setTimeout(() => {
      markMapStart();
      // At low priority: a keystroke interrupts the map's re-render.
      startTransition(() => setSettled(value));
    }, delay_ms);
    return () => clearTimeout(timer);
  }, [value, settled, delay_ms]);
  return settled;
}
