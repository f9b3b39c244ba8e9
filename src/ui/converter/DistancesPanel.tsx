import { type ClipboardEvent, type FocusEvent, type KeyboardEvent, useId, useMemo } from 'react';
import type { Unit } from '../../io/quantity';
import { fitDistances, PhysicsError } from '../../physics';
import { formatSignificant } from '../units/format-number';
import { useSekundoStore } from '../store';
import type { DisplayUnitOf } from '../units/unit-choices';
import { displayUnitView } from '../units/use-display-unit';
import { shownFieldUnit } from '../fields/field-spec';
import { converterFieldKey, FIELD_SPECS } from './converter-fields';
import { sentence } from './converter-checks';
import type { DistanceColumn } from './converter-slice';
import { ConversionResult } from './ConversionResult';
import { tableExport } from './export-text';
import { distanceColumnHelp } from './converter-help';
import { useFieldHelp } from '../help/FieldHelp';
import { currentUnitViews, useUnitViews } from '../units/unit-views';
import { chooseFor, distanceFit, distanceFitTable } from './reading-results';
import { readDistanceRows, splitPasted } from './table-input';
import { useFieldValues } from './use-converter';
import { useOwnForm } from '../fields/OwnForm';

const UNITS: Readonly<Record<DistanceColumn, readonly Unit[]>> = {
  distance: ['mm', 'cm', 'm', 'µm'],
  delay: ['ms', 'µs', 's'],
  sd: ['µs', 'ns', 'ms', 's'],
};
const COLUMN_NAMES: Readonly<Record<DistanceColumn, string>> = { distance: 'Distance', delay: 'Delay', sd: 'Delay sd' };
const COLUMNS: readonly DistanceColumn[] = ['distance', 'delay', 'sd'];

/** Reads the table and fits it; the store keeps the last good points, or the message. */
export function commitDistances(): void {
  const { converterDistanceRows, converterDistanceUnits, commitConverterDistances } = useSekundoStore.getState();
  const read = readDistanceRows(converterDistanceRows, converterDistanceUnits);
  if (!read.ok) {
    commitConverterDistances(read);
    return;
  }
  try {
    fitDistances(read.value.points);
  } catch (error) {
    if (!(error instanceof PhysicsError)) throw error;
    commitConverterDistances({ ok: false, message: sentence(error.message) });
    return;
  }
  commitConverterDistances({ ok: true, points: read.value });
}

/** The distance table: rows of distance, delay and optional sd; Enter, leaving the table or “Fit” applies it. */
export function DistancesInput() {
  const headingId = useId();
  const tableId = useId();
  // The table's boxes share one form of their own (OwnForm.tsx).
  const ownForm = useOwnForm();
  const rows = useSekundoStore((s) => s.converterDistanceRows);
  const units = useSekundoStore((s) => s.converterDistanceUnits);
  const error = useSekundoStore((s) => s.converterDistanceError);
  const editCell = useSekundoStore((s) => s.editConverterDistanceCell);
  const addRow = useSekundoStore((s) => s.addConverterDistanceRow);
  const removeRow = useSekundoStore((s) => s.removeConverterDistanceRow);
  const setRows = useSekundoStore((s) => s.setConverterDistanceRows);
  const setUnit = useSekundoStore((s) => s.setConverterDistanceUnit);
  const topics = distanceColumnHelp(units);
  const help = {
    distance: useFieldHelp('distance column', topics.distance),
    delay: useFieldHelp('delay column', topics.delay),
    sd: useFieldHelp('delay sd column', topics.sd),
  };

  const onBlur = (event: FocusEvent<HTMLTableElement>) => {
    if (event.relatedTarget instanceof Node && event.currentTarget.contains(event.relatedTarget)) return;
    commitDistances();
  };
  const onKeyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key === 'Enter') {
      event.preventDefault();
      commitDistances();
    }
  };
  const onPaste = (event: ClipboardEvent<HTMLInputElement>) => {
    const text = event.clipboardData.getData('text/plain');
    if (!/[\n\t,;]/.test(text.trim())) return;
    event.preventDefault();
    const pasted = splitPasted(text).filter((cells) => cells.some((c) => /\d/.test(c)));
    setRows(pasted.map((cells) => ({ distance: cells[0] ?? '', delay: cells[1] ?? '', sd: cells[2] ?? '' })));
    commitDistances();
  };

  return (
    <section className="card converter-card" aria-labelledby={headingId}>
      <h2 id={headingId} className="card-title">
        Delays at several distances
      </h2>
      <p className="muted converter-card__lead">
        Sensors at different distances in one bath: t = t₀ + d/u₂. A straight-line fit gives u₂ and the common offset t₀. The delay sd is optional: give
        it on every row or on none (then the scatter sets the uncertainties). Paste rows from a spreadsheet into any cell.
      </p>
      <div className="help-panels">
        {help.distance.panel}
        {help.delay.panel}
        {help.sd.panel}
      </div>
      <div className="table-scroll">
        <table id={tableId} className="distance-table" onBlur={onBlur}>
          <thead>
            <tr>
              <th scope="col" className="distance-table__index">
                #
              </th>
              {COLUMNS.map((column) => (
                <th key={column} scope="col">
                  <span className="distance-table__head">
                    {COLUMN_NAMES[column]}
                    <select
                      className="unit-select"
                      aria-label={`${COLUMN_NAMES[column]} unit`}
                      aria-describedby={help[column].describedBy}
                      value={units[column]}
                      onChange={(event) => {
                        setUnit(column, event.target.value as Unit);
                        commitDistances();
                      }}
                    >
                      {UNITS[column].map((u) => (
                        <option key={u} value={u}>
                          {u}
                        </option>
                      ))}
                    </select>
                    {help[column].button}
                  </span>
                </th>
              ))}
              <th scope="col" className="distance-table__remove">
                <span className="visually-hidden">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((row, i) => (
              <tr key={row.key}>
                <th scope="row">{i + 1}</th>
                {COLUMNS.map((column) => (
                  <td key={column}>
                    <input
                      form={ownForm.id}
                      className="text-input converter-input converter-input--cell"
                      type="text"
                      inputMode="decimal"
                      autoComplete="off"
                      spellCheck={false}
                      aria-label={`Row ${i + 1} ${COLUMN_NAMES[column].toLowerCase()}`}
                      aria-describedby={help[column].describedBy}
                      value={row[column]}
                      onChange={(event) => editCell(row.key, column, event.target.value)}
                      onKeyDown={onKeyDown}
                      onPaste={onPaste}
                    />
                  </td>
                ))}
                <td>
                  <button type="button" className="icon-button" aria-label={`Remove row ${i + 1}`} onClick={() => removeRow(row.key)}>
                    ×
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        {ownForm.element}
      </div>
      <div className="setup-form__actions">
        <button type="button" className="button" onClick={addRow}>
          Add a row
        </button>
        <button type="button" className="button button--primary" onClick={commitDistances}>
          Fit
        </button>
      </div>
      {error ? (
        <p className="field-error" role="alert">
          {error} The last good fit stays in effect.
        </p>
      ) : null}
    </section>
  );
}

/**
 * The fit of the distance table: speed, t₀, their correlation, residuals and the candidates, in the
 * header's display units. Residuals and the scatter stay in µs, like the sd fields (on their ladder,
 * src/ui/fields/field-spec.ts): they are orders of magnitude below the delays, and no header unit is finer.
 */
export function DistancesResult() {
  const points = useSekundoStore((s) => s.converterDistancePoints);
  const kind = useSekundoStore((s) => s.converterChoice);
  const values = useFieldValues();
  const applyValues = useSekundoStore((s) => s.applyConverterValues);
  const { length, temperature } = useUnitViews();
  const displayUnits = useSekundoStore((s) => s.displayUnits);
  const ownOffsetUnit = useSekundoStore((s) => s.fieldUnits[converterFieldKey('offset')]);
  const fit = useMemo(() => distanceFit(points), [points]);
  const chosen = useMemo(() => (fit?.ok ? chooseFor(fit.value.candidates, kind, values, temperature.unit) : null), [fit, kind, values, temperature.unit]);
  if (fit === null) {
    return (
      <p className="card converter-empty" role="status">
        Fill in at least three rows at two or more distances, then press Fit.
      </p>
    );
  }
  if (!fit.ok || chosen === null || points === null) {
    return (
      <p className="card field-error" role="alert">
        {fit.ok ? '' : fit.message}
      </p>
    );
  }
  const f = fit.value;
  // t₀ in the unit the offset field would show it in, as it would be typed there.
  const offsetUnit = displayUnitView((shownFieldUnit(FIELD_SPECS.offset, f.offset_s, displayUnits, ownOffsetUnit) ?? 'µs') as DisplayUnitOf<'time'>);
  const exportContent = () => {
    return tableExport('sekundo-distance-fit.csv', distanceFitTable(f, chosen, currentUnitViews()));
  };
  return (
    <ConversionResult
      title="Fitted speed and temperature"
      chartId="converter-fit-speed"
      speed_m_s={f.speed_m_s}
      speedSd_m_s={f.speedSd_m_s}
      speedLabel="from the fit"
      candidates={f.candidates}
      chosen={chosen}
      exportContent={exportContent}
    >
      <div className="fit-figures">
        <dl className="state-list">
          <div>
            <dt>Offset t₀</dt>
            <dd>
              {offsetUnit.measured(f.offset_s, f.offsetSd_s).text} {offsetUnit.shown}{' '}
              <button type="button" className="button button--small" onClick={() => applyValues({ offset: f.offset_s, offsetSd: f.offsetSd_s })}>
                Use as the offset
              </button>
            </dd>
          </div>
          <div>
            <dt>Correlation (u₂, t₀)</dt>
            <dd>{formatSignificant(f.correlation, 3)}</dd>
          </div>
          <div>
            <dt>Covariance (1/u₂, t₀)</dt>
            <dd>
              var(1/u₂) {formatSignificant(f.covariance[0][0], 3)} s²/m², cov {formatSignificant(f.covariance[0][1], 3)} s²/m, var(t₀){' '}
              {formatSignificant(f.covariance[1][1], 3)} s²
            </dd>
          </div>
          <div>
            <dt>{f.weighted ? 'χ² / degrees of freedom' : 'Scatter (rms residual)'}</dt>
            <dd>
              {f.weighted
                ? `${formatSignificant(f.chiSquare, 3)} / ${f.degreesOfFreedom} (weighted by the sds given)`
                : `${formatSignificant(Math.sqrt(f.chiSquare / Math.max(1, f.degreesOfFreedom)) * 1e6, 2)} µs over ${f.degreesOfFreedom} degree${f.degreesOfFreedom === 1 ? '' : 's'} of freedom (no sds given: the scatter sets the uncertainties)`}
            </dd>
          </div>
        </dl>
        <div className="table-scroll">
          <table className="properties-table residuals-table">
            <caption>Residuals of the fit</caption>
            <thead>
              <tr>
                <th scope="col">Row</th>
                <th scope="col" className="num">
                  Distance
                </th>
                <th scope="col" className="num">
                  Residual
                </th>
              </tr>
            </thead>
            <tbody>
              {f.residuals_s.map((r, i) => (
                <tr key={points.rows[i] ?? i}>
                  <th scope="row">{points.rows[i]}</th>
                  <td className="num">
                    {length.format(points.points[i]?.distance_m ?? 0)} {length.shown}
                  </td>
                  <td className="num">{formatSignificant(r * 1e6, 3)} µs</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </div>
    </ConversionResult>
  );
}
