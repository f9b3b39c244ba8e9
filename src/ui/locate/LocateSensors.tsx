import { Fragment, useId } from 'react';
import { useSekundoStore } from '../store';
import { LOCATE_ROWS_KEY } from '../store/locate-slice';
import { arrivalEdit, arrivalSpec, labelEdit, positionEdit, positionSpec, sensorSdEdit, sensorSdSpec } from './locate-fields';
import type { LocateRowInput } from './locate-inputs';
import { LocateField } from './LocateField';

/** The sensors as an editable table: label, position, arrival time (or blank) and timing sd. */
export function LocateSensors() {
  const rows = useSekundoStore((s) => s.locateRows);
  const add = useSekundoStore((s) => s.addLocateSensor);
  const rowsError = useSekundoStore((s) => s.locateErrors[LOCATE_ROWS_KEY]);
  const defaultSd = useSekundoStore((s) => s.locateOptions.arrivalSd_s);
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
        Positions in mm, arrival times in ms on any common clock, timing sd in µs (a bare number is in the column’s unit; you may type another: 0.12 m,
        11563 us). Leave the arrival blank for a sensor without a reading; leave the sd blank to use the default ({(defaultSd * 1e6).toPrecision(3)} µs).
      </p>
      <div className="table-scroll">
        <table className="locate-table locate-sensors-table" aria-label="Sensor positions and readings">
          <thead>
            <tr>
              <th scope="col">Label</th>
              <th scope="col">x (mm)</th>
              <th scope="col">y (mm)</th>
              <th scope="col">z (mm)</th>
              <th scope="col">Arrival (ms)</th>
              <th scope="col">Timing sd (µs)</th>
              <th scope="col">
                <span className="visually-hidden">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((row) => (
              <SensorRow key={row.key} row={row} />
            ))}
          </tbody>
        </table>
      </div>
      {rows.length === 0 ? <p className="muted">No sensors: add one, or open a sensor CSV.</p> : null}
      {rowsError ? (
        <p className="field-error" role="alert">
          {rowsError}
        </p>
      ) : null}
    </section>
  );
}

function SensorRow({ row }: { row: LocateRowInput }) {
  const remove = useSekundoStore((s) => s.removeLocateSensor);
  const errors = useSekundoStore((s) => s.locateErrors);
  const labelId = useId();
  const prefix = `row.${row.key}.`;
  const messages = Object.entries(errors).filter(([key]) => key.startsWith(prefix));
  return (
    <Fragment>
      <tr>
        <td>
          <LabelField row={row} id={labelId} />
        </td>
        {([0, 1, 2] as const).map((axis) => (
          <td key={axis} className="locate-cell">
            <LocateField
              fieldKey={`${prefix}${'xyz'[axis]}`}
              spec={positionSpec(row.label, axis)}
              value={row.position_m[axis]}
              edit={positionEdit(row, axis)}
              label={`${'xyz'[axis]} of ${row.label} (mm)`}
              hideLabel
              inlineMessage={false}
            />
          </td>
        ))}
        <td className="locate-cell">
          <LocateField
            fieldKey={`${prefix}arrival`}
            spec={arrivalSpec(row.label)}
            value={row.arrival_s}
            edit={arrivalEdit(row)}
            label={`Arrival at ${row.label} (ms)`}
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

function LabelField({ row, id }: { row: LocateRowInput; id: string }) {
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
        onChange={(event) => type(key, event.target.value, labelEdit(row))}
        onBlur={() => leave(key)}
        onKeyDown={(event) => {
          if (event.key === 'Escape') discard(key);
        }}
      />
    </>
  );
}
