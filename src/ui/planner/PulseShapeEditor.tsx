import { useId, useState } from 'react';
import { CUSTOM_PULSE_MAX_POINTS } from '../../physics';
import { describedBy, HelpColumnHead, HelpLabel, useFieldHelp } from '../help/FieldHelp';
import { usePagedRows } from '../layout/TablePager';
import { useSekundoStore } from '../store';
import { PLANNER_FIELD_PREFIX } from './planner-slice';
import { QuantityField } from '../fields/QuantityField';
import { PlanControlMessage } from './PlanControlMessage';
import { usePlanField } from './use-plan-field';
import { addPulsePoint, customPoints, parsePastedPoints, removePulsePoint, setPulsePoints, setShape, type ShapeKind, shapeKind } from './plan-edits';
import { fieldRangeText, HEATER_FIELDS, pulsePointField } from './plan-fields';
import { PLAN_OTHER_HELP, planNumberHelp } from './planner-help';
import { inputText, KINDS, shownLadder } from '../units/ladders';
import { RemoveIcon } from './RowIcons';
import { useOwnForm } from '../fields/OwnForm';

const SHAPES = [
  { value: 'rectangle', label: 'Rectangle' },
  { value: 'half-sine', label: 'Half-sine' },
  { value: 'custom', label: 'Custom points' },
] as const;

/** Pulse shape, width and rise time; a custom pulse as an editable list of points or pasted lines. */
export function PulseShapeEditor() {
  const kind = useSekundoStore((s) => shapeKind(s.plannerPlan));
  const edit = useSekundoStore((s) => s.editPlanner);
  const shapeHelp = useFieldHelp('pulse shape', PLAN_OTHER_HELP['heater.shape']);
  const width = usePlanField(HEATER_FIELDS.width);
  const riseTime = usePlanField(HEATER_FIELDS.riseTime);
  return (
    <div className="plan-grid plan-grid--pulse">
      <div className="plan-field">
        <HelpLabel htmlFor="planner-shape" className="plan-field__label" help={shapeHelp}>
Pulse shape
</HelpLabel>
        <select id="planner-shape" className="plan-select" value={kind} aria-describedby={shapeHelp.describedBy} onChange={(event) => edit('heater.shape', (p) => setShape(p, event.target.value as ShapeKind), 'pulse.')}>
          {SHAPES.map((s) => (
            <option key={s.value} value={s.value}>
              {s.label}
            </option>
          ))}
        </select>
        <PlanControlMessage controlKey="heater.shape" />
      </div>
      {kind === 'custom' ? null : <QuantityField {...width} label="Pulse width" />}
      {kind === 'rectangle' ? <QuantityField {...riseTime} label="Rise time" hint="Edge time of the heater drive." /> : null}
      {kind === 'custom' ? <CustomPoints /> : null}
    </div>
  );
}

function CustomPoints() {
  const points = useSekundoStore((s) => customPoints(s.plannerPlan));
  const units = useSekundoStore((s) => s.displayUnits);
  const time = shownLadder(KINDS.time, units);
  const edit = useSekundoStore((s) => s.editPlanner);
  const count = points.length;
  const timeRange = useSekundoStore((s) => fieldRangeText(pulsePointField(0, 0), s.plannerPlan));
  const amplitudeRange = useSekundoStore((s) => fieldRangeText(pulsePointField(0, 1), s.plannerPlan));
  const timeHelp = useFieldHelp('time from onset', planNumberHelp(pulsePointField(0, 0), timeRange));
  const amplitudeHelp = useFieldHelp('relative amplitude', planNumberHelp(pulsePointField(0, 1), amplitudeRange));
  const { start, end, pager } = usePagedRows(count);
  return (
    <div className="pulse-points">
      <div className="help-panels">
        {timeHelp.panel}
        {amplitudeHelp.panel}
      </div>
      <div className="table-scroll">
        <table className="plan-table pulse-points__table">
          <caption className="visually-hidden">Custom pulse points</caption>
          <thead>
            <tr>
              <th scope="col">#</th>
              <HelpColumnHead help={timeHelp}>Time from onset</HelpColumnHead>
              <HelpColumnHead help={amplitudeHelp}>Relative amplitude</HelpColumnHead>
              <th scope="col">
                <span className="visually-hidden">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {points.slice(start, end).map((_, k) => (
              // Points have no identity beyond their place; drafts are cleared when the list changes.
              // biome-ignore lint/suspicious/noArrayIndexKey: see the line above
              <PointRow key={start + k} index={start + k} count={count} timeHelp={timeHelp.describedBy} amplitudeHelp={amplitudeHelp.describedBy} />
            ))}
          </tbody>
        </table>
      </div>
      {pager('points')}
      <PointMessages />
      <div className="pulse-points__actions">
        <button type="button" className="button button--small" disabled={count >= CUSTOM_PULSE_MAX_POINTS} onClick={() => edit('pulse.points', addPulsePoint, 'pulse.')}>
          Add point
        </button>
        <span className="field-hint">
          Amplitudes are scaled so the largest is 1; the pulse lasts until the last point ({inputText(points[count - 1]?.[0] ?? 0, time.ladder, time.zero)}).
        </span>
      </div>
      <PastePoints />
    </div>
  );
}

/** One custom pulse point: its time and amplitude, and its remove button. */
function PointRow({ index: i, count, timeHelp, amplitudeHelp }: { index: number; count: number; timeHelp: string; amplitudeHelp: string }) {
  const edit = useSekundoStore((s) => s.editPlanner);
  const time = usePlanField(pulsePointField(i, 0));
  const amplitude = usePlanField(pulsePointField(i, 1));
  return (
    <tr>
      <td className="num">{i + 1}</td>
      <td>
        <QuantityField {...time} label={`Point ${i + 1} time`} labelHidden message="elsewhere" describedBy={timeHelp} />
      </td>
      <td>
        <QuantityField {...amplitude} label={`Point ${i + 1} amplitude`} labelHidden message="elsewhere" describedBy={amplitudeHelp} />
      </td>
      <td>
        <button type="button" className="icon-button" disabled={count <= 2} aria-label={`Remove point ${i + 1}`} onClick={() => edit('pulse.points', (p) => removePulsePoint(p, i), 'pulse.')}>
          <RemoveIcon />
        </button>
      </td>
    </tr>
  );
}

/** Paste "t, a" lines (from a spreadsheet or a scope export) to replace the points. */
function PastePoints() {
  const id = useId();
  const ownForm = useOwnForm();
  const [text, setText] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const edit = useSekundoStore((s) => s.editPlanner);
  const error = useSekundoStore((s) => s.plannerErrors['pulse.paste']);
  const pasteHelp = useFieldHelp('pasted pulse points', PLAN_OTHER_HELP['pulse.paste']);
  const apply = () => {
    const parsed = parsePastedPoints(text);
    if (!parsed.ok) {
      setProblem(parsed.message);
      return;
    }
    setProblem(null);
    edit('pulse.paste', (p) => setPulsePoints(p, parsed.points), 'pulse.');
  };
  const message = problem ?? error;
  return (
    <details className="pulse-paste">
      <summary>Paste points as “time, amplitude” lines</summary>
      <HelpLabel htmlFor={id} className="plan-field__label" help={pasteHelp}>
Pulse points, one “time, amplitude” per line
</HelpLabel>
      <textarea
        id={id}
        form={ownForm.id}
        className="text-input pulse-paste__text"
        rows={5}
        value={text}
        placeholder={'0 us, 0\n2 us, 1\n98 us, 1\n100 us, 0'}
        spellCheck={false}
        aria-invalid={message ? true : undefined}
        aria-describedby={describedBy(message && `${id}-message`, pasteHelp.describedBy)}
        onChange={(event) => setText(event.target.value)}
      />
      {ownForm.element}
      <div className="pulse-points__actions">
        <button type="button" className="button button--small" onClick={apply} disabled={text.trim() === ''}>
          Use these points
        </button>
        <span className="field-hint">A bare time is in seconds; # starts a comment.</span>
      </div>
      {message ? (
        <p id={`${id}-message`} className="field-error" role="alert">
          {message}
        </p>
      ) : null}
    </details>
  );
}

/** Messages of the point fields (the table cells have no room for them), and of the list itself. */
function PointMessages() {
  // Messages of every point (those on other pages too), in point order, then the list's own.
  const shown = useSekundoStore((s) =>
    [...Object.keys(s.plannerErrors), ...Object.keys(s.fieldDrafts).filter((k) => k.startsWith(PLANNER_FIELD_PREFIX) && s.fieldDrafts[k]?.message).map((k) => k.slice(PLANNER_FIELD_PREFIX.length))]
      .filter((k) => /^pulse\.\d+\./.test(k) || k === 'pulse.points')
      .sort((a, b) => (a === 'pulse.points' ? 1 : b === 'pulse.points' ? -1 : a.localeCompare(b, undefined, { numeric: true })))
      .join('\n'),
  );
  if (shown === '') return null;
  return (
    <div className="pulse-points__messages">
      {shown.split('\n').map((k) => (
        <PlanControlMessage key={k} controlKey={k} />
      ))}
    </div>
  );
}
