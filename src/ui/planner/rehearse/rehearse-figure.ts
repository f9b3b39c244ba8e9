/**
 * The rehearsal's chart: the first few synthetic records of one sensor around its search window,
 * each with its pick, and the true arrival of the feature (times after the heater onset).
 */
import type { RehearsalSensorResult } from '../../../io/rehearse-run';
import type { PlotLayout, PlotTrace } from '../../plot/plotly-types';
import { type DisplayUnit, inUnit } from '../../units/ladders';
import { PLANNER_COLOURS, SENSOR_COLOURS } from '../planner-colours';

/** Colours of the records, in order (the planner's own palette; the wrapper turns them for the dark theme). */
const RECORD_COLOURS = [SENSOR_COLOURS[0], SENSOR_COLOURS[2], SENSOR_COLOURS[1]];

export function rehearseFigure(s: RehearsalSensorResult, time: DisplayUnit, volts: DisplayUnit): { data: PlotTrace[]; layout: PlotLayout } {
  const data: PlotTrace[] = [];
  let top = 0;
  let bottom = 0;
  for (const k of s.kept) for (const v of k.values) {
    top = Math.max(top, inUnit(v, volts));
    bottom = Math.min(bottom, inUnit(v, volts));
  }
  s.kept.forEach((k, i) => {
    const colour = RECORD_COLOURS[i % RECORD_COLOURS.length] as string;
    data.push({
      type: 'scatter',
      mode: 'lines',
      name: `Trial ${k.trial + 1}`,
      x: Array.from(k.time_s, (t) => inUnit(t, time)),
      y: Array.from(k.values, (v) => inUnit(v, volts)),
      line: { color: colour, width: 1 },
    });
    if (k.pick_s !== null) {
      data.push({
        type: 'scatter',
        mode: 'lines',
        name: `Pick, trial ${k.trial + 1}`,
        x: [inUnit(k.pick_s, time), inUnit(k.pick_s, time)],
        y: [bottom, top],
        line: { color: colour, width: 1.5, dash: 'dot' },
        showlegend: false,
      });
    }
  });
  const truth = s.arrival_s + (s.kept[0] && s.kept[0].pick_s !== null && s.kept[0].delay_s !== null ? s.kept[0].pick_s - s.kept[0].delay_s : 0);
  data.push({ type: 'scatter', mode: 'lines', name: 'True arrival', x: [inUnit(truth, time), inUnit(truth, time)], y: [bottom, top], line: { color: PLANNER_COLOURS.planned, width: 2, dash: 'dash' } });
  return {
    data,
    layout: {
      height: 320,
      margin: { l: 64, r: 16, t: 40, b: 48 },
      xaxis: { title: { text: `Time after the heater onset (${time.shown})` } },
      yaxis: { title: { text: `Sensor (${volts.shown})` } },
      // Above the plot, so it never meets the axis title on a narrow screen.
      legend: { orientation: 'h', x: 0, y: 1.02, xanchor: 'left', yanchor: 'bottom' },
      dragmode: 'zoom',
    },
  };
}
