import type { Choice, ChoiceRule, TemperatureCandidate } from '../../physics';
import { formatSignificant } from '../format/format-number';
import { branchWords, type CandidateFlag, candidateFlags, choiceNote } from './candidate-notes';

interface CandidatesTableProps {
  candidates: readonly TemperatureCandidate[];
  rule: ChoiceRule | null;
  choice: Choice;
  /** Accessible name and visible caption, e.g. "Temperatures with u = 20.00 m/s". */
  caption: string;
}

/** A temperature to the decimals its sd supports: at least 0.1 mK, at most 1 µK ("1.7851"). */
export function formatTemperature(T_K: number, sd_K: number): string {
  const decimals = Number.isFinite(sd_K) && sd_K > 0 ? Math.min(6, Math.max(4, Math.ceil(-Math.log10(sd_K)) + 1)) : 4;
  return T_K.toFixed(decimals);
}

/** The sd of a temperature in mK, two significant digits. */
export function formatSdMillikelvin(sd_K: number): string {
  return `${formatSignificant(sd_K * 1e3, 2)} mK`;
}

/**
 * Every candidate temperature with its sd, slope, branch and flags; the chosen one highlighted,
 * the others kept with the reason they were not chosen. Flags are explained under the table.
 */
export function CandidatesTable({ candidates, rule, choice, caption }: CandidatesTableProps) {
  const flags = new Map<CandidateFlag['key'], CandidateFlag>();
  for (const c of candidates) for (const f of candidateFlags(c)) if (!flags.has(f.key)) flags.set(f.key, f);
  if (candidates.length === 0) {
    return (
      <p className="converter-empty" role="status">
        No temperature between 0.3 K and Tλ has this speed.
      </p>
    );
  }
  return (
    <div className="table-scroll">
      <table className="properties-table candidates-table">
        <caption>{caption}</caption>
        <thead>
          <tr>
            <th scope="col">#</th>
            <th scope="col" className="num">
              Temperature
            </th>
            <th scope="col" className="num">
              sd
            </th>
            <th scope="col" className="num as-written">
              du₂/dT (m/s/K)
            </th>
            <th
              scope="col"
              className="as-written"
              title="Branch of u₂(T): low (below the minimum near 1.12 K), middle (between the extrema), high (above the maximum near 1.65 K)"
            >
              Branch of u₂
            </th>
            <th scope="col">Notes</th>
            <th scope="col">Choice</th>
          </tr>
        </thead>
        <tbody>
          {candidates.map((c, i) => {
            const chosen = choice.index === i;
            return (
              <tr key={`${c.branch}-${c.kind}`} className={chosen ? 'candidate is-chosen' : choice.index === null ? 'candidate' : 'candidate is-other'} aria-current={chosen ? 'true' : undefined}>
                <th scope="row" className="candidate-index">
                  {i + 1}
                </th>
                <td className="num value">{formatTemperature(c.temperature_K, c.sd_K)} K</td>
                <td className="num uncertainty">± {formatSdMillikelvin(c.sd_K)}</td>
                <td className="num">{formatSignificant(c.slope_m_s_K, 3)}</td>
                <td className="nowrap">{c.kind === 'extremum' ? 'at the extremum' : branchWords(c.branch)}</td>
                <td>
                  {candidateFlags(c).length === 0 ? <span className="muted">—</span> : null}
                  {candidateFlags(c).map((f) => (
                    <span key={f.key} className={`badge candidate-flag candidate-flag--${f.key}`} title={f.explanation}>
                      {f.label}
                    </span>
                  ))}
                </td>
                <td className="candidate-choice">
                  {chosen ? <span className="badge badge--chosen">Chosen</span> : null} {choiceNote(candidates, i, rule, choice).replace(/^Chosen: /, '')}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {flags.size > 0 ? (
        <ul className="flag-notes">
          {[...flags.values()].map((f) => (
            <li key={f.key}>
              <strong>{f.label}:</strong> {f.explanation}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
