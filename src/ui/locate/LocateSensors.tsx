import { Fragment, useId } from 'react';
import { usePagedRows } from '../layout/TablePager';
import { HelpColumnHead, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { LOCATE_ROWS_KEY } from '../store/locate-slice';
import { useDisplayUnit } from '../units/use-display-unit';
import { arrivalEdit, arrivalSpec, labelEdit, type LengthUnit, positionEdit, positionSpec, sensorSdEdit, sensorSdSpec, type TimeUnit } from './locate-fields';
import { LOCATE_HELP } from './locate-help';
import type { LocateRowInput } from './locate-inputs';
import { LocateField } from './LocateField';

/** Units of the table's columns, and the ids of each column's help. */
interface Columns {
  length: { unit: LengthUnit; shown: string };
  time: { unit: TimeUnit; shown: string };
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
  const columns: Columns = {
    length: { unit: length.unit, shown: length.shown },
    time: { unit: time.unit, shown: time.shown },
    help: { label: labelHelp.describedBy, position: positionHelp.describedBy, arrival: arrivalHelp.describedBy, sd: sdHelp.describedBy },
  };
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
        Positions in {length.shown}, arrival times in {time.shown} on any common clock, timing sd in µs (a bare number is in the column’s unit; you may
        type another: 0.12 m, 11563 us). Leave the arrival blank for a sensor without a reading; leave the sd blank to use the default (
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
              <HelpColumnHead help={positionHelp}>x <span className="unit-as-written">({length.shown})</span></HelpColumnHead>
              <th scope="col">
                y <span className="unit-as-written">({length.shown})</span>
              </th>
              <th scope="col">
                z <span className="unit-as-written">({length.shown})</span>
              </th>
              <HelpColumnHead help={arrivalHelp}>Arrival <span className="unit-as-written">({time.shown})</span></HelpColumnHead>
              <HelpColumnHead help={sdHelp}>Timing sd <span className="unit-as-written">(µs)</span></HelpColumnHead>
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

function SensorRow({ row, columns }: { row: LocateRowInput; columns: Columns }) {
  const remove = useSekundoStore((s) => s.removeLocateSensor);
  const errors = useSekundoStore((s) => s.locateErrors);
  const labelId = useId();
  const prefix = `row.${row.key}.`;
  const messages = Object.entries(errors).filter(([key]) => key.startsWith(prefix));
  return (
    <Fragment>
      <tr>
        <td>
          <LabelField row={row} id={labelId} describedBy={columns.help.label} />
        </td>
        {([0, 1, 2] as const).map((axis) => (
          <td key={axis} className="locate-cell">
            <LocateField
              fieldKey={`${prefix}${'xyz'[axis]}`}
              spec={positionSpec(row.label, axis, columns.length.unit)}
              value={row.position_m[axis]}
              edit={positionEdit(row, axis, columns.length.unit)}
              label={`${'xyz'[axis]} of ${row.label} (${columns.length.shown})`}
              describedBy={columns.help.position}
              hideLabel
              inlineMessage={false}
            />
          </td>
        ))}
        <td className="locate-cell">
          <LocateField
            fieldKey={`${prefix}arrival`}
            spec={arrivalSpec(row.label, columns.time.unit)}
            value={row.arrival_s}
            edit={arrivalEdit(row, columns.time.unit)}
            label={`Arrival at ${row.label} (${columns.time.shown})`}
            describedBy={columns.help.arrival}
            hideLabel
            inlineMessage={false}
            placeholder="no reading"
          />
        </td>
        <td className="locate-cell">
          <LocateField
            fieldKey={`${prefix}sd`}
            spec={sensorSdSpec(row.label)}
            value={row.arrivalSd_s}
            edit={sensorSdEdit(row)}
            label={`Timing sd of ${row.label} (µs)`}
            describedBy={columns.help.sd}
            hideLabel
            inlineMessage={false}
            placeholder="default"
          />
        </td>
        <td className="locate-row-actions">
          <button type="button" className="button button--small locate-remove" onClick={() => remove(row.key)} aria-label={`Remove sensor ${row.label}`} title={`Remove sensor ${row.label}`}>
            ✕
          </button>
        </td>
      </tr>
      {messages.length > 0 ? (
        <tr className="locate-row-messages">
          <td colSpan={7}>
            {messages.map(([key, message]) => (
              <p key={key} className="field-error" role="alert">
                {message}
              </p>
            ))}
          </td>
        </tr>
      ) : null}
    </Fragment>
  );
}

function LabelField({ row, id, describedBy }: { row: LocateRowInput; id: string; describedBy: string }) {
  const key = `row.${row.key}.label`;
  const draft = useSekundoStore((s) => s.locateDrafts[key]);
  const error = useSekundoStore((s) => s.locateErrors[key]);
  const type = useSekundoStore((s) => s.typeLocateField);
  const leave = useSekundoStore((s) => s.leaveLocateField);
  const discard = useSekundoStore((s) => s.discardLocateDraft);
  return (
    <>
      <label htmlFor={id} className="visually-hidden">
        Label of sensor {row.label}
      </label>
      <input
        id={id}
        className="locate-input locate-input--label"
        type="text"
        autoComplete="off"
        spellCheck={false}
        value={draft ?? row.label}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        onChange={(event) => type(key, event.target.value, labelEdit(row))}
        onBlur={() => leave(key)}
        onKeyDown={(event) => {
          if (event.key === 'Escape') discard(key);
        }}
      />
    </>
  );
}
