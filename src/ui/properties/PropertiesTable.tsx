import { PROPERTY_CATALOGUE } from '../../physics';
import { useHeliumProperties, useSekundoStore } from '../store';
import { formatKelvin } from '../temperature/temperature-units';
import { PropertyRow } from './PropertyRow';

/** Every property of the catalogue at the chosen temperature, with unit, uncertainty and source. */
export function PropertiesTable() {
  const properties = useHeliumProperties();
  const detailsShown = useSekundoStore((state) => state.sourceDetailsShown);
  const setDetailsShown = useSekundoStore((state) => state.setSourceDetailsShown);
  return (
    <section className="card" aria-labelledby="properties-title">
      <div className="card-head">
        <h2 id="properties-title" className="card-title">
          Properties
        </h2>
        <label className="toggle">
          <input type="checkbox" checked={detailsShown} onChange={(event) => setDetailsShown(event.target.checked)} />
          Show notes and full sources
        </label>
      </div>
      <div className="table-scroll">
        <table className="properties-table">
          <caption>
            Liquid helium-4 at {formatKelvin(properties.temperature_K)} K along the saturated vapour pressure. ± is
            one standard deviation where the reference states one.
          </caption>
          <thead>
            <tr>
              <th scope="col">Property</th>
              <th scope="col" className="num">
                Value
              </th>
              <th scope="col">Unit</th>
              <th scope="col" className="num as-written">
                ±1σ
              </th>
              <th scope="col">Source</th>
            </tr>
          </thead>
          <tbody>
            {PROPERTY_CATALOGUE.map((info) => (
              <PropertyRow key={info.key} info={info} properties={properties} detailsShown={detailsShown} />
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
