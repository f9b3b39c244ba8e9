import type { HeliumProperties, PropertyInfo } from '../../physics';
import { displayProperty, type PropertyUnits, propertyUnit, shortSource } from './property-display';

interface PropertyRowProps {
  info: PropertyInfo;
  properties: HeliumProperties;
  detailsShown: boolean;
  units: PropertyUnits;
}

/** One property: symbol and name, value or the reason it is absent, unit, uncertainty, source. */
export function PropertyRow({ info, properties, detailsShown, units }: PropertyRowProps) {
  const display = displayProperty(info, properties, units);
  const rowClass = [display.kind === 'absent' ? 'is-absent' : '', detailsShown ? 'has-details' : ''].join(' ').trim() || undefined;
  return (
    <>
      <tr className={rowClass} data-property={info.key}>
        <th scope="row" className="property-name">
          <span className="label">{info.label}</span> <span className="symbol">{info.symbol}</span>
        </th>
        {display.kind === 'value' ? (
          <>
            <td className="num value">{display.value}</td>
            <td className="unit">{propertyUnit(info, units)}</td>
            <td className="num uncertainty">{display.uncertainty ?? <NotStated />}</td>
          </>
        ) : (
          <td className="absent-reason" colSpan={3}>
            {display.reason}
          </td>
        )}
        <td className="source">{shortSource(info)}</td>
      </tr>
      {detailsShown ? (
        <tr className="details-row">
          <td colSpan={5}>
            <p>{info.note}</p>
            <p className="full-source">Source: {info.source}</p>
          </td>
        </tr>
      ) : null}
    </>
  );
}

function NotStated() {
  return (
    <>
      <span aria-hidden="true">—</span>
      <span className="visually-hidden">not stated</span>
    </>
  );
}
