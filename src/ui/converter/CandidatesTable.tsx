import { type Choice, type ChoiceRule, PROPERTIES_RANGE_K, type TemperatureCandidate } from '../../physics';
import { formatSignificant } from '../units/format-number';
import { useDisplayUnit } from '../units/use-display-unit';
import { branchWords, type CandidateFlag, candidateFlags, choiceNote } from './candidate-notes';
import { limitText } from '../units/unit-views';
import { LADDERS, readText } from '../units/ladders';

/** A distance from the evidence in sd: "12 sd" (flagged past 3), or a dash without evidence. */
function evidenceText(d: number | null | undefined): string {
  if (d === null || d === undefined) return '—';
  return `${formatSignificant(d, 2)} sd${d > 3 ? ' (far)' : ''}`;
}

interface CandidatesTableProps {
  candidates: readonly TemperatureCandidate[];
  rule: ChoiceRule | null;
  choice: Choice;
  /** Accessible name and visible caption, e.g. "Temperatures with u = 20.00 m/s". */
  caption: string;
}

/**
 * Every candidate temperature with its sd, slope, branch and flags; the chosen one highlighted,
 * the others kept with the reason they were not chosen. Flags are explained under the table.
 */
export function CandidatesTable({ candidates, rule, choice, caption }: CandidatesTableProps) {
  const temperature = useDisplayUnit('temperature');
  // An sd on its own: in the unit that suits its size (µK, mK, K), as the planner shows differences.
  const sdText = (K: number) => readText(K, LADDERS.temperatureDifference, 2);
  const intervalWords = (interval: readonly [number, number], reaches: readonly string[], sd: number) => {
    const turn = reaches.filter((r) => r === 'minimum' || r === 'maximum' || r === 'Tλ');
    return `${temperature.measured(interval[0], sd).value} – ${temperature.measured(interval[1], sd).value} ${temperature.shown}${turn.length > 0 ? ` (to the ${turn.join(', ')})` : ''}`;
  };
  const flags = new Map<CandidateFlag['key'], CandidateFlag>();
  for (const c of candidates) for (const f of candidateFlags(c)) if (!flags.has(f.key)) flags.set(f.key, f);
  if (candidates.length === 0) {
    return (
      <p className="converter-empty" role="status">
        No temperature between {limitText(PROPERTIES_RANGE_K[0], temperature)} and Tλ has this speed.
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
            <th scope="col" className="num" title="The sd in its two parts: the measurement's (distance, timing, offset — what limits a change between readings) and the u₂ curve's own (the same for every reading)">
              measurement / u₂ curve
            </th>
            <th scope="col" className="num" title="Every temperature whose u₂ lies within 1 σ (68 %) or 1.96 σ (95 %) of the speed, on this candidate's stretch of the curve">
              68 % · 95 % interval
            </th>
            <th scope="col" className="num" title="How far the candidate lies from the evidence (the vapour-pressure or expected temperature), in sd">
              From evidence
            </th>
            <th scope="col" className="num">
              du₂/dT (m/s/K)
            </th>
            <th
              scope="col"
             
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
            // The value and its sd rounded together, in the display unit.
            const T = temperature.measured(c.temperature_K, c.sd_K);
            return (
              <tr key={`${c.branch}-${c.kind}`} className={chosen ? 'candidate is-chosen' : choice.index === null ? 'candidate' : 'candidate is-other'} aria-current={chosen ? 'true' : undefined}>
                <th scope="row" className="candidate-index">
                  {i + 1}
                </th>
                <td className="num value">
                  {T.value} {temperature.shown}
                </td>
                <td className="num uncertainty">{T.sd === null ? '' : `± ${T.sd} ${temperature.shown}`}</td>
                <td className="num uncertainty">
                  {sdText(c.sdMeasurement_K)} / {sdText(c.sdCurve_K)}
                </td>
                <td className="num interval-cell">
                  <span>
                    <span className="muted">68 %</span> {intervalWords(c.interval68_K, c.reaches68, c.sd_K)}
                  </span>
                  <br />
                  <span>
                    <span className="muted">95 %</span> {intervalWords(c.interval95_K, c.reaches95, c.sd_K)}
                  </span>
                </td>
                <td className="num">{evidenceText(choice.evidenceSd[i])}</td>
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
                  {chosen ? <span className="badge badge--chosen">Chosen</span> : null} {choiceNote(candidates, i, rule, choice, temperature.unit).replace(/^Chosen: /, '')}
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
