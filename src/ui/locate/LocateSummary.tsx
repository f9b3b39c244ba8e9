import { CsvExportButton } from '../export/CsvExportButton';
import { formatMeasured } from '../units/format-measured';
import { formatSignificant } from '../units/format-number';
import { useDisplayUnit } from '../units/use-display-unit';
import { AXIS_NAMES } from './locate-inputs';
import { useLocateFit } from './use-locate';

/** The located source with its sds, the emission time, the speed, the fit; or plainly why there is none. */
export function LocateSummary() {
  // The fit on screen and the inputs it is for: a keystroke in the table leaves this as it is.
  const { outcome, rows, options } = useLocateFit();
  const fitSpeed = options.fitSpeed;
  const length = useDisplayUnit('length');
  const time = useDisplayUnit('time');
  if (!outcome.ok) {
    return (
      <section className="card locate-card locate-summary" aria-labelledby="locate-summary-title">
        <h2 id="locate-summary-title" className="card-title">
          Located source
        </h2>
        <div className="locate-none" role="status">
          <p>
            <strong>No source located.</strong> {outcome.message}
          </p>
          <p className="muted">Enter arrival times in the sensor table or open a CSV of readings. The layout-quality map below works without readings.</p>
        </div>
      </section>
    );
  }
  const { result: r, speed, outcomes } = outcome;
  const sd = r.sourceSd_m;
  const fitted = outcomes.filter((o) => o.status === 'fitted' || o.status === 'outlier').length;
  const outliers = outcomes.filter((o) => o.status === 'outlier').map((o) => o.label);
  const dropped = outcomes.filter((o) => o.status === 'dropped').map((o) => o.label);
  const noArrival = outcomes.filter((o) => o.status === 'no arrival').length;
  const reducedChi = r.degreesOfFreedom > 0 ? r.chiSquare / r.degreesOfFreedom : Number.NaN;
  // Each coordinate to the digit its sd supports (no sd: where the fit stopped, four digits).
  const position = r.source_m.map((x, k) => length.measured(x, sd ? (sd[k as 0] ?? null) : null));
  const t0 = time.measured(r.offset_s, r.offsetSd_s);
  const speedText = formatMeasured(r.speed_m_s, r.speedSd_m_s);
  const csv = () => ({
    header: ['quantity', 'value', 'sd', 'unit'],
    rows: [
      ...r.source_m.map((x, k) => [`source ${AXIS_NAMES[k]}`, length.fromSi(x), sd ? length.fromSi(sd[k as 0] ?? Number.NaN) : null, length.unit]),
      ['emission time t0', time.fromSi(r.offset_s), r.offsetSd_s === null ? null : time.fromSi(r.offsetSd_s), time.unit],
      ['speed', r.speed_m_s, r.speedSd_m_s, 'm/s'],
      ['chi-square', r.chiSquare, null, ''],
      ['degrees of freedom', r.degreesOfFreedom, null, ''],
      ['determined', r.degenerate ? 'no' : 'yes', null, ''],
    ],
  });
  return (
    <section className="card locate-card locate-summary" aria-labelledby="locate-summary-title">
      <div className="card-head">
        <h2 id="locate-summary-title" className="card-title">
          Located source
        </h2>
        <CsvExportButton table={csv} fileName="located-source.csv" what="the located source" />
      </div>
      {r.degenerate ? (
        <div className="locate-degenerate" role="status">
          <p>
            <strong>This layout cannot fix the source.</strong> No position or uncertainty can be given; the numbers below are only where the fit stopped.
          </p>
          <ul>
            {r.notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
          <p>Move or add a sensor off the line (the map below shows where one helps most), or hold the source on a surface.</p>
        </div>
      ) : null}
      <div className="table-scroll">
        <table className="locate-position" aria-label={r.degenerate ? 'Where the fit stopped (not determined)' : 'Source position'}>
          <thead>
            <tr>
              <th scope="col" className="locate-position__axis" />
              {AXIS_NAMES.map((n) => (
                <th key={n} scope="col" className="locate-position__axis">
                  {n} ({length.shown})
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            <tr>
              <th scope="row" className="locate-position__row">
                {r.degenerate ? 'fit stopped at' : 'source'}
              </th>
              {r.source_m.map((_, k) => (
                <td key={AXIS_NAMES[k]} className="locate-position__value" data-testid={`locate-source-${AXIS_NAMES[k]}`}>
                  {position[k]?.value}
                </td>
              ))}
            </tr>
            <tr>
              <th scope="row" className="locate-position__row">
                1σ
              </th>
              {[0, 1, 2].map((k) => (
                <td key={AXIS_NAMES[k]} className="num">
                  {position[k]?.sd ? `± ${position[k]?.sd}` : '—'}
                </td>
              ))}
            </tr>
          </tbody>
        </table>
      </div>
      <dl className="locate-facts">
        <div>
          <dt>Emission time t0</dt>
          <dd>
            {t0.text} {time.shown}
            <span className="locate-facts__detail">on the clock of the arrival times</span>
          </dd>
        </div>
        <div>
          <dt>Speed</dt>
          <dd>
            {speedText.text} m/s
            <span className="locate-facts__detail" data-testid="locate-speed-how">
              {r.speedPrior
                ? `fitted within u₂’s own uncertainty: prior ${speed.from} = ${formatSignificant(r.speedPrior.speed_m_s, 4)} ± ${formatSignificant(r.speedPrior.sd_m_s, 2)} m/s`
                : fitSpeed
                  ? `fitted freely, starting from ${speed.from}`
                  : `fixed: ${speed.from}`}
            </span>
          </dd>
        </div>
        <div>
          <dt>Fit</dt>
          <dd>
            χ² {formatSignificant(r.chiSquare, 3)} for {r.degreesOfFreedom} degrees of freedom
            <span className="locate-facts__detail">
              {Number.isFinite(reducedChi) && reducedChi > 1 ? `sds scaled up by √(χ²/dof) = ${formatSignificant(Math.sqrt(reducedChi), 3)}` : 'residuals within the stated timing sds'}
            </span>
          </dd>
        </div>
        <div>
          <dt>Sensors</dt>
          <dd>
            {fitted} of {rows.length} fitted
            <span className="locate-facts__detail">
              {[
                outliers.length > 0 ? `outlier${outliers.length > 1 ? 's' : ''} kept: ${outliers.join(', ')}` : '',
                dropped.length > 0 ? `left out: ${dropped.join(', ')}` : '',
                noArrival > 0 ? `${noArrival} without an arrival time` : '',
              ]
                .filter(Boolean)
                .join('; ') || 'no outliers'}
            </span>
          </dd>
        </div>
      </dl>
      {!r.degenerate && r.notes.length > 0 ? (
        <ul className="locate-notes">
          {r.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
