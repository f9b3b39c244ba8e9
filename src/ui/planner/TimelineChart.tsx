import { ChartFigure } from '../charts/ChartFigure';
import { PlotlyChart } from '../plot/PlotlyChart';
import { themedColour } from '../plot/plot-theme';
import { useSekundoStore } from '../store';
import type { TimelineView } from './planner-slice';
import { useResolvedTheme } from '../theme/use-theme';
import { PLANNER_COLOURS } from './planner-colours';
import { reportDrawn } from './recompute-timer';
import { type DisplayUnit, inUnit } from '../units/ladders';
import { shownIsUpdating, useTimelineFigure } from './plan-engine';
import { formatTime, type TimelineKeyEntry } from './timeline-figure';
import { usePlanOutcome } from './use-plan';
import { useShownLadders } from '../units/use-shown-ladders';
import { useElementWidth } from '../layout/use-element-width';

/** Chart id of the timeline (tests read the drawn figure from the element with this data-chart). */
export const TIMELINE_CHART_ID = 'planner-timeline';
/** Horizontal room Plotly takes for the axis and margins, px. */
const PLOT_MARGIN_PX = 80;

const VIEWS: readonly { value: TimelineView; label: string }[] = [
  { value: 'arrivals', label: 'Direct arrivals' },
  { value: 'record', label: 'Whole record' },
  { value: 'early', label: 'Heater and first sound' },
];

/** One pulse, from the heater to every sensor: predicted waveforms, arrivals and the record window. */
export function TimelineChart() {
  const outcome = usePlanOutcome();
  const view = useSekundoStore((s) => s.plannerTimelineView);
  const setView = useSekundoStore((s) => s.setPlannerTimelineView);
  const [box, width] = useElementWidth<HTMLDivElement>(900);
  const columns = Math.max(100, width - PLOT_MARGIN_PX);
  const result = outcome.ok ? outcome.result : null;
  const timeUnit = useShownLadders().time[0] as DisplayUnit;
  // Built by the plan worker beside the results (on this thread where no worker runs).
  const figure = useTimelineFigure(outcome, { view, columns, timeUnit });
  if (!result || !figure) return null;
  const second = result.sensors.filter((s) => s.secondSoundArrival_s !== null);
  const summary =
    second.length > 0
      ? `Second sound arrives at ${second.map((s) => `${s.id} ${formatTime(s.secondSoundArrival_s as number, timeUnit)}`).join(', ')}.`
      : 'No second sound (He I): only first sound arrives.';
  return (
    <ChartFigure
      id={TIMELINE_CHART_ID}
      title="Timeline of one pulse"
      caption={
        <>
          <span className="caption-values">{summary}</span> Top: heater flux. Below: predicted δT at each sensor (linear
          theory). Vertical lines mark the arrivals; each marker on top has its sensor’s colour. Shaded: the record
          window.
          {figure.echoes.shown < figure.echoes.inView
            ? ` Echoes marked: each sensor’s earliest, ${figure.echoes.shown.toLocaleString('en-GB')} of the ${figure.echoes.inView.toLocaleString('en-GB')} in this span.`
            : null}
        </>
      }
    >
      <fieldset className="timeline-views">
        <legend className="visually-hidden">Time span shown</legend>
        {VIEWS.map((v) => (
          <button key={v.value} type="button" className="chip" aria-pressed={view === v.value} onClick={() => setView(v.value)}>
            {v.label}
          </button>
        ))}
        <span className="field-hint">{spanText(figure.range_s, timeUnit)}</span>
      </fieldset>
      <div ref={box} className="timeline-box">
        <PlotlyChart
          chartId={TIMELINE_CHART_ID}
          label={`Timeline of one heater pulse with the predicted signal at ${result.sensors.length} sensors. ${summary}`}
          data={figure.data}
          layout={figure.layout}
          // The edit → result time counts the draw of the newest plan's figure only.
          onDrawn={() => {
            if (!shownIsUpdating()) reportDrawn('timeline');
          }}
        />
      </div>
      <TimelineKey entries={figure.key} />
    </ChartFigure>
  );
}

/** "−0.153 to 3.05 ms": the span shown, in the chosen time unit. */
function spanText([from, to]: [number, number], unit: DisplayUnit): string {
  const text = (t: number) => String(Number(inUnit(t, unit).toPrecision(3))).replace(/^-/, '\u2212');
  return `${text(from)} to ${text(to)} ${unit.shown}`;
}

/** The chart's key in HTML: what each colour and line style means. */
function TimelineKey({ entries }: { entries: readonly TimelineKeyEntry[] }) {
  const theme = useResolvedTheme();
  return (
    <ul className="timeline-key" aria-label="Key to the timeline">
      {entries.map((entry) => (
        <li key={entry.label} className={`timeline-key__item timeline-key__item--${entry.kind.replace(' ', '-')}`}>
          <svg viewBox="0 0 28 12" width="28" height="12" aria-hidden="true" focusable="false">
            <KeySymbol entry={{ ...entry, colour: themedColour(entry.colour, theme) }} fill={themedColour(PLANNER_COLOURS.heaterFill, theme)} />
          </svg>
          {entry.label}
        </li>
      ))}
    </ul>
  );
}

function KeySymbol({ entry, fill }: { entry: TimelineKeyEntry; fill: string }) {
  const stroke = entry.colour;
  switch (entry.kind) {
    case 'fill':
      return <path d="M1 11V3h12v8z" fill={fill} stroke={stroke} strokeWidth="1.2" />;
    case 'line':
      return <path d="M1 6h26" stroke={stroke} strokeWidth="2.4" />;
    case 'first sound':
      return (
        <>
          <path d="M14 4v8" stroke={stroke} strokeWidth="1.4" strokeDasharray="1.5 1.5" />
          <path d="M10.5 1h7L14 5z" fill="none" stroke={stroke} strokeWidth="1.1" />
        </>
      );
    case 'second sound':
      return (
        <>
          <path d="M14 4v8" stroke={stroke} strokeWidth="1.4" />
          <path d="M10.5 1h7L14 5z" fill={stroke} />
        </>
      );
    default:
      return (
        <>
          <path d="M14 5v7" stroke={stroke} strokeWidth="1.2" strokeDasharray="3 1.5" />
          <path d="M14 0.5l2.5 2.5L14 5.5 11.5 3z" fill="none" stroke={stroke} strokeWidth="1.1" />
        </>
      );
  }
}
