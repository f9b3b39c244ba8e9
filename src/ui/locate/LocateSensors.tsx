import { Fragment, memo, useMemo } from 'react';
import { useShallow } from 'zustand/react/shallow';
import { usePagedRows } from '../layout/TablePager';
import { HelpColumnHead, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { LOCATE_ROWS_KEY } from './locate-slice';
import { useDisplayUnit } from '../units/use-display-unit';
import { fieldMessageId, QuantityField, TextField } from '../fields/QuantityField';
import { arrivalEdit, arrivalSpec, LOCATE_FIELD_PREFIX, labelEdit, locateFieldKey, positionEdit, positionSpec, sensorSdEdit, sensorSdSpec } from './locate-fields';
import { locateFieldProps, locateTextProps } from './locate-field-props';
import { LOCATE_HELP } from './locate-help';
import type { LocateRowInput } from './locate-inputs';

/** Units of the table's columns, and the ids of each column's help. */
interface Columns {
  length: { shown: string };
  time: { shown: string };
  help: { label: string; position: string; arrival: string; sd: string };
}

/** The sensors as an editable table: label, position, arrival time (or blank) and timing sd. */
export function LocateSensors() {
  const rows = useSekundoStore((s) => s.locateRows);
  const add = useSekundoStore((s) => s.addLocateSensor);
  const rowsError = useSekundoStore((s) => s.locateErrors[LOCATE_ROWS_KEY]);
  const defaultSd = useSekundoStore((s) => s.locateOptions.arrivalSd_s);
  const length = useDisplayUnit('length');
  const time = useDisplayUnit('time');
  const labelHelp = useFieldHelp('sensor label', LOCATE_HELP.label);
  const positionHelp = useFieldHelp('sensor position', LOCATE_HELP.position(length.shown));
  const arrivalHelp = useFieldHelp('arrival time', LOCATE_HELP.arrival(time.shown));
  const sdHelp = useFieldHelp('timing sd of a sensor', LOCATE_HELP.sensorSd);
  const { start, end, pager } = usePagedRows(rows.length);
  // One object while the units and help stay: the rows are memoised, and a keystroke re-renders
  // only the row it changed (its row object is new; the others are the same objects).
  const columns: Columns = useMemo(
    () => ({
      length: { shown: length.shown },
      time: { shown: time.shown },
      help: { label: labelHelp.describedBy, position: positionHelp.describedBy, arrival: arrivalHelp.describedBy, sd: sdHelp.describedBy },
    }),
    [length.shown, time.shown, labelHelp.describedBy, positionHelp.describedBy, arrivalHelp.describedBy, sdHelp.describedBy],
  );
  return (
    <section className="card locate-card" aria-labelledby="locate-sensors-title">
      <div className="card-head">
        <h2 id="locate-sensors-title" className="card-title">
          Sensors
        </h2>
        <button type="button" className="button" onClick={add}>
          Add a sensor
        </button>
      </div>
      <p className="muted locate-lead">
        Positions in {length.shown}, arrival times in {time.shown} on any common clock, each timing sd in the unit beside it (a bare number is in the
        unit shown; you may type another: 0.12 m, 11563 us). Leave the arrival blank for a sensor without a reading; leave the sd blank to use the default (
        {(defaultSd * 1e6).toPrecision(3)} µs). The “?” in a column’s heading says more.
      </p>
      <div className="help-panels">
        {labelHelp.panel}
        {positionHelp.panel}
        {arrivalHelp.panel}
        {sdHelp.panel}
      </div>
      <div className="table-scroll">
        <table className="locate-table locate-sensors-table" aria-label="Sensor positions and readings">
          <thead>
            <tr>
              <HelpColumnHead help={labelHelp}>Label</HelpColumnHead>
              <HelpColumnHead help={positionHelp}>x ({length.shown})</HelpColumnHead>
              <th scope="col">
                y ({length.shown})
              </th>
              <th scope="col">
                z ({length.shown})
              </th>
              <HelpColumnHead help={arrivalHelp}>Arrival ({time.shown})</HelpColumnHead>
              <HelpColumnHead help={sdHelp}>Timing sd</HelpColumnHead>
              <th scope="col">
                <span className="visually-hidden">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.slice(start, end).map((row) => (
              <SensorRow key={row.key} row={row} columns={columns} />
            ))}
          </tbody>
        </table>
      </div>
      {pager('sensors')}
      {rows.length === 0 ? <p className="muted">No sensors: add one, or open a sensor CSV.</p> : null}
      {rowsError ? (
        <p className="field-error" role="alert">
          {rowsError}
        </p>
      ) : null}
    </section>
  );
}

const SensorRow = memo(function SensorRow({ row, columns }: { row: LocateRowInput; columns: Columns }) {
  const remove = useSekundoStore((s) => s.removeLocateSensor);
  const prefix = `row.${row.key}.`;
  // Messages of the row's fields (the fields slice) and of its controls, in one list under the row.
  const messages = useSekundoStore(
    useShallow((s) => [
      ...Object.entries(s.fieldDrafts)
        .filter(([key, draft]) => key.startsWith(locateFieldKey(prefix)) && draft.message !== null)
        .map(([key, draft]) => [key, draft.message as string] as const),
      ...Object.entries(s.locateErrors).filter(([key]) => key.startsWith(prefix)),
    ].flat()),
  );
  const pairs: [string, string][] = [];
  for (let i = 0; i + 1 < messages.length; i += 2) pairs.push([messages[i] as string, messages[i + 1] as string]);
  return (
    <Fragment>
      <tr>
        <td>
          <TextField {...locateTextProps(`${prefix}label`, row.label, labelEdit(row))} label={`Label of sensor ${row.label}`} labelHidden message="elsewhere" describedBy={columns.help.label} className="locate-label-field" />
        </td>
        {([0, 1, 2] as const).map((axis) => (
          <td key={axis} className="locate-cell">
            <QuantityField
              {...locateFieldProps(`${prefix}${'xyz'[axis]}`, positionSpec(row.label, axis), row.position_m[axis], positionEdit(row, axis))}
              label={`${'xyz'[axis]} of ${row.label} (${columns.length.shown})`}
              describedBy={columns.help.position}
              labelHidden
              message="elsewhere"
            />
          </td>
        ))}
        <td className="locate-cell">
          <QuantityField
            {...locateFieldProps(`${prefix}arrival`, arrivalSpec(row.label), row.arrival_s, arrivalEdit(row))}
            label={`Arrival at ${row.label} (${columns.time.shown})`}
            describedBy={columns.help.arrival}
            labelHidden
            message="elsewhere"
          />
        </td>
        <td className="locate-cell">
          <QuantityField
            {...locateFieldProps(`${prefix}sd`, sensorSdSpec(row.label), row.arrivalSd_s, sensorSdEdit(row))}
            label={`Timing sd of ${row.label}`}
            describedBy={columns.help.sd}
            labelHidden
            message="elsewhere"
            placeholder="default"
          />
        </td>
        <td className="locate-row-actions">
          <button type="button" className="button button--small locate-remove" onClick={() => remove(row.key)} aria-label={`Remove sensor ${row.label}`} title={`Remove sensor ${row.label}`}>
            ✕
          </button>
        </td>
      </tr>
      {pairs.length > 0 ? (
        <tr className="locate-row-messages">
          <td colSpan={7}>
            {pairs.map(([key, message]) => (
              <p key={key} id={fieldMessageId(key.startsWith(LOCATE_FIELD_PREFIX) ? key : locateFieldKey(key))} className="field-error" role="alert">
                {message}
              </p>
            ))}
          </td>
        </tr>
      ) : null}
    </Fragment>
  );
});
