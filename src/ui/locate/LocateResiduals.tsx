import type { SensorStatus } from '../../io/locate-csv';
import { usePagedRows } from '../layout/TablePager';
import { CsvExportButton } from '../export/CsvExportButton';
import { formatFixed, formatSignificant } from '../units/format-number';
import { useDisplayUnit } from '../units/use-display-unit';
import { useLocateFit } from './use-locate';

/** Decimals of a predicted arrival: 0.1 µs in any unit. */
const PREDICTED_DECIMALS = { ms: 4, µs: 1, s: 7 } as const;

const STATUS_TEXT: Record<SensorStatus, string> = {
  fitted: 'fitted',
  outlier: 'OUTLIER, kept in the fit',
  dropped: 'OUTLIER, left out of the fit',
  'no arrival': 'no reading, not fitted',
};

/** Largest |residual/σ| the bars show; beyond it a bar is cut and marked. */
const BAR_LIMIT = 6;

/** Residual of each sensor (measured − predicted arrival), its size in sds as a bar, and its part in the fit. */
export function LocateResiduals() {
  const { outcome, rows } = useLocateFit();
  const time = useDisplayUnit('time');
  const page = usePagedRows(outcome.ok ? outcome.outcomes.length : 0);
  const csv = () =>
    outcome.ok
      ? {
          header: ['sensor', `predicted arrival (${time.unit})`, 'residual (us)', 'residual / sd', 'status'],
          rows: outcome.outcomes.map((o) => [o.label, time.fromSi(o.predictedArrival_s), o.residual_s === null ? null : o.residual_s * 1e6, o.normalisedResidual, STATUS_TEXT[o.status]]),
        }
      : null;
  return (
    <section className="card locate-card" aria-labelledby="locate-residuals-title">
      <div className="card-head">
        <h2 id="locate-residuals-title" className="card-title">
          Residuals per sensor
        </h2>
        <CsvExportButton table={csv} fileName="locate-residuals.csv" what="the residuals table" disabled={!outcome.ok} />
      </div>
      {!outcome.ok ? (
        <p className="muted">No fit, so no residuals. {outcome.message}</p>
      ) : (
        <>
          <div className="table-scroll">
            <table className="locate-table locate-residuals-table" aria-label="Residual of each sensor">
              <thead>
                <tr>
                  <th scope="col">Sensor</th>
                  <th scope="col" className="num">
                    Predicted ({time.shown})
                  </th>
                  <th scope="col" className="num">
                    Residual (µs)
                  </th>
                  <th scope="col" className="num">
                    in σ
                  </th>
                  <th scope="col">
                    <span className="visually-hidden">Residual in σ as a bar, ±{BAR_LIMIT}σ</span>
                  </th>
                  <th scope="col">Status</th>
                </tr>
              </thead>
              <tbody>
                {outcome.outcomes.slice(page.start, page.end).map((o, k) => {
                  const i = page.start + k;
                  const z = o.normalisedResidual;
                  const flagged = o.status === 'outlier' || o.status === 'dropped';
                  return (
                    <tr key={rows[i]?.key ?? o.label} className={flagged ? 'locate-flagged' : undefined}>
                      <th scope="row">{o.label}</th>
                      <td className="num">{formatFixed(time.fromSi(o.predictedArrival_s), PREDICTED_DECIMALS[time.unit])}</td>
                      <td className="num">{o.residual_s === null ? '—' : formatFixed(o.residual_s * 1e6, 1)}</td>
                      <td className="num">{z === null ? '—' : formatSignificant(z, 2)}</td>
                      <td className="locate-resbar-cell" aria-hidden="true">
                        {z === null ? null : <ResidualBar z={z} flagged={flagged} />}
                      </td>
                      <td className={flagged ? 'locate-status locate-status--flagged' : 'locate-status'}>{STATUS_TEXT[o.status]}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
          {page.pager('sensors')}
          <p className="chart-caption">
            Residual: measured minus predicted arrival. Bars run from the centre line to ±{BAR_LIMIT}σ; sensors beyond 3σ are outliers, named in the
            status column (a robust refit in the fit options leaves them out one at a time).
          </p>
        </>
      )}
    </section>
  );
}

function ResidualBar({ z, flagged }: { z: number; flagged: boolean }) {
  const clipped = Math.max(-BAR_LIMIT, Math.min(BAR_LIMIT, z));
  const width = (Math.abs(clipped) / BAR_LIMIT) * 50;
  const style = clipped >= 0 ? { left: '50%', width: `${width}%` } : { left: `${50 - width}%`, width: `${width}%` };
  return (
    <span className="locate-resbar">
      <span className="locate-resbar__limit locate-resbar__limit--low" />
      <span className="locate-resbar__limit locate-resbar__limit--high" />
      <span className={flagged ? 'locate-resbar__fill locate-resbar__fill--flagged' : 'locate-resbar__fill'} style={style} />
      {Math.abs(z) > BAR_LIMIT ? <span className={`locate-resbar__cut locate-resbar__cut--${z > 0 ? 'high' : 'low'}`}>»</span> : null}
    </span>
  );
}
