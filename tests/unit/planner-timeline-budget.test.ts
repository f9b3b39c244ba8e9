/**
 * The timeline of a crowded plan stays drawable: the sensors share a budget of waveform points and
 * each sensor's earliest echoes are marked, within a budget, with the count in the figure for the
 * caption. A small plan is drawn as before (a column per pixel, every echo). Common practice, no
 * source: the budgets are the page's own.
 */
import { readFileSync } from 'node:fs';
import { parsePlanFile, planFileToInput } from '../../src/io/plan-file';
import { computePlan } from '../../src/physics';
import { ECHO_MARK_BUDGET, MIN_ECHOES_PER_SENSOR, timelineFigure } from '../../src/ui/planner/timeline-figure';
import { limitCases } from '../support/limit-plans';

const demo = JSON.parse(readFileSync('public/demo-plan.json', 'utf8'));

function resultOf(plan: unknown) {
  const parsed = parsePlanFile(JSON.stringify(plan));
  if (!parsed.ok) throw new Error(parsed.errors.join('; '));
  return computePlan(planFileToInput(parsed.plan));
}

/** Points of the sensors' waveform traces (one trace per sensor, grouped under its id). */
const sensorPoints = (fig: ReturnType<typeof timelineFigure>, ids: readonly string[]) =>
  fig.data.filter((d) => ids.includes(String(d.legendgroup)) && d.mode === 'lines').reduce((n, d) => n + (d.x?.length ?? 0), 0);

describe('timeline of a crowded plan', () => {
  it('64 sensors between two plates at echo order 12: points and echo marks within their budgets, the count kept', { timeout: 60_000 }, () => {
    const many = limitCases(demo).find((c) => c.name.startsWith('64 sensors, no planes'));
    if (!many) throw new Error('no case');
    const plan = {
      ...many.plan,
      echoOrder: 12,
      reflectors: [
        { label: 'Far plate', axis: 'z', position_m: 0.06, reflection: 0.5 },
        { label: 'Side plate', axis: 'x', position_m: 0.02, reflection: 0.5 },
        { label: 'Other side', axis: 'x', position_m: -0.02, reflection: 0.5 },
      ],
    };
    const result = resultOf(plan);
    const fig = timelineFigure(result, 'record', 1000);
    expect(ECHO_MARK_BUDGET).toBe(600);
    expect(fig.echoes.inView).toBeGreaterThan(ECHO_MARK_BUDGET);
    expect(fig.echoes.shown).toBeLessThanOrEqual(ECHO_MARK_BUDGET);
    expect(fig.echoes.shown).toBeGreaterThanOrEqual(64 * MIN_ECHOES_PER_SENSOR);
    const marks = fig.data.find((d) => d.name === 'Arrivals');
    // Every first- and second-sound arrival is marked, plus the echoes shown.
    expect(marks?.x?.length).toBe(64 * 2 + fig.echoes.shown);
    // About two points per column, 24 000 shared by 64 sensors (187 columns each), plus segment breaks.
    expect(sensorPoints(fig, result.sensors.map((s) => s.id))).toBeLessThan(30_000);
  });

  it('the demo: every echo marked and a column per pixel', () => {
    const result = resultOf(demo);
    const fig = timelineFigure(result, 'record', 1000);
    expect(fig.echoes.shown).toBe(fig.echoes.inView);
    // A few sensors keep a column per pixel: a wider chart gets more points.
    const ids = result.sensors.map((s) => s.id);
    expect(sensorPoints(fig, ids)).toBeGreaterThan(sensorPoints(timelineFigure(result, 'record', 200), ids));
  });
});
