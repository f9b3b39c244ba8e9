import { type HeliumProperties, PROPERTY_CATALOGUE } from '../../physics';
import { CsvExportButton } from '../export/CsvExportButton';
import type { CsvTableData } from '../export/csv-export';
import { useFieldHelp } from '../help/FieldHelp';
import { useHeliumProperties, useSekundoStore } from '../store';
import { TEMPERATURE_HELP } from '../temperature/temperature-help';
import { formatTemperature } from '../units/temperature-text';
import { fromSi } from '../units/unit-choices';
import { useDisplayUnit } from '../units/use-display-unit';
import { absentReasonOf, type PropertyUnits, propertyUnit, propertyValue } from './property-display';
import { PropertyRow } from './PropertyRow';

/**
 * The table as CSV: one row per property, every digit the kernel gave, in the units shown; an
 * absent value leaves its cells empty and says why in the note.
 */
export function propertiesCsv(properties: HeliumProperties, units: PropertyUnits, temperatureUnit: 'K' | 'mK'): CsvTableData {
  const T = fromSi(properties.temperature_K, temperatureUnit);
  return {
    header: [`temperature (${temperatureUnit})`, 'property', 'symbol', 'value', 'sd', 'unit', 'note', 'source'],
    rows: PROPERTY_CATALOGUE.map((info) => {
      const shown = propertyValue(info, properties, units);
      return [T, info.label, info.symbol, shown?.value, shown?.sd, propertyUnit(info, units), shown === null ? absentReasonOf(info.key, properties) : '', info.source];
    }),
  };
}

/** Every property of the catalogue at the chosen temperature, with unit, uncertainty and source. */
export function PropertiesTable() {
  const properties = useHeliumProperties();
  const detailsShown = useSekundoStore((state) => state.sourceDetailsShown);
  const setDetailsShown = useSekundoStore((state) => state.setSourceDetailsShown);
  const pressure = useDisplayUnit('pressure');
  const temperature = useDisplayUnit('temperature');
  const units: PropertyUnits = { pressure: pressure.unit };
  const detailsHelp = useFieldHelp('show notes and full sources', TEMPERATURE_HELP.details);
  const at = formatTemperature(properties.temperature_K, temperature.unit);
  return (
    <section className="card" aria-labelledby="properties-title">
      <div className="card-head">
        <h2 id="properties-title" className="card-title">
          Properties
        </h2>
        <div className="table-tools">
          <label className="toggle">
            <input
              type="checkbox"
              checked={detailsShown}
              aria-describedby={detailsHelp.describedBy}
              onChange={(event) => setDetailsShown(event.target.checked)}
            />
            Show notes and full sources
          </label>
          {detailsHelp.button}
          <CsvExportButton
            table={() => propertiesCsv(properties, units, temperature.unit)}
            fileName={`helium-properties-${at.replace(' ', '')}.csv`}
            what="the property table"
          />
        </div>
      </div>
      {detailsHelp.panel}
      <div className="table-scroll">
        <table className="properties-table">
          <caption>
            Liquid helium-4 at {at} along the saturated vapour pressure. ± is
            one standard deviation where the reference states one.
          </caption>
          <thead>
            <tr>
              <th scope="col">Property</th>
              <th scope="col" className="num">
                Value
              </th>
              <th scope="col">Unit</th>
              <th scope="col" className="num">
                ±1σ
              </th>
              <th scope="col">Source</th>
            </tr>
          </thead>
          <tbody>
            {PROPERTY_CATALOGUE.map((info) => (
              <PropertyRow key={info.key} info={info} properties={properties} detailsShown={detailsShown} units={units} />
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
