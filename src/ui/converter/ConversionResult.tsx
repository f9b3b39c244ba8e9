import { type ReactNode, useId } from 'react';
import { candidateWarnings, PROPERTIES_RANGE_K, type ReadingWarning, speedSigmasFromTurn, type TemperatureCandidate } from '../../physics';
import { formatSignificant } from '../units/format-number';
import { PanelErrorBoundary } from '../layout/PanelErrorBoundary';
import { useDisplayUnit } from '../units/use-display-unit';
import { CandidatesTable } from './CandidatesTable';
import { limitText, fixedTemperatureText } from '../units/unit-views';
import type { Chosen } from './reading-results';
import type { ExportContent } from './export-text';
import { ResultActions } from './ResultActions';
import { SpeedChart } from './SpeedChart';
import { symbolCase } from '../layout/symbol-case';

interface ConversionResultProps {
  /** Heading of the result card. */
  title: string;
  /** Id of the chart (data-chart). */
  chartId: string;
  speed_m_s: number;
  speedSd_m_s: number;
  /** How the speed was found, e.g. "u = d/(t − t₀)". */
  speedLabel: string;
  candidates: readonly TemperatureCandidate[];
  chosen: Chosen;
  exportContent: () => ExportContent | null;
  /** Extra figures under the key figures (a fit's offset and correlation). */
  children?: ReactNode;
}

/** A speed, the temperature chosen from it (or the candidates), the candidates table and the u₂ chart. */
export function ConversionResult({ title, chartId, speed_m_s, speedSd_m_s, speedLabel, candidates, chosen, exportContent, children }: ConversionResultProps) {
  const headingId = useId();
  const { choice, rule } = chosen;
  const pick = choice.index === null ? undefined : candidates[choice.index];
  const temperature = useDisplayUnit('temperature');
  // The chosen temperature and its sd rounded together, in the display unit.
  const picked = pick ? temperature.measured(pick.temperature_K, pick.sd_K) : null;
  const fmt = (T: number) => fixedTemperatureText(T, temperature.unit);
  const warnings: ReadingWarning[] = [...choice.warnings, ...(pick ? candidateWarnings(pick, speedSigmasFromTurn(pick, speed_m_s, speedSd_m_s), fmt) : [])];
  return (
    <>
      <section className="card converter-card result-card" aria-labelledby={headingId}>
        <div className="card-head">
          <h2 id={headingId} className="card-title">
            {symbolCase(title)}
          </h2>
          <ResultActions what="result" content={exportContent} />
        </div>
        <dl className="key-figures converter-figures">
          <div className="key-figure">
            <dt>{pick ? 'Temperature' : 'Candidates'}</dt>
            <dd>
              {pick && picked ? (
                <>
                  <span className="key-figure__value" data-testid="chosen-temperature">
                    {picked.value}
                  </span>{' '}
                  <span className="key-figure__unit">{picked.sd === null ? temperature.shown : `± ${picked.sd} ${temperature.shown}`}</span>
                  <span className="key-figure__detail">
                    candidate {(choice.index ?? 0) + 1} of {candidates.length}, {pick.branch} branch (u₂ {pick.branch === 'middle' ? 'rising' : 'falling'})
                  </span>
                  <span className="key-figure__detail" data-testid="chosen-interval">
                    95 %: {temperature.measured(pick.interval95_K[0], pick.sd_K).value} – {temperature.measured(pick.interval95_K[1], pick.sd_K).value} {temperature.shown}
                  </span>
                </>
              ) : (
                <>
                  <span className="key-figure__value">{candidates.length}</span>{' '}
                  <span className="key-figure__unit">{candidates.length === 1 ? 'temperature' : 'temperatures'}</span>
                  <span className="key-figure__detail">{candidates.map((c) => `${temperature.measured(c.temperature_K, c.sd_K).value} ${temperature.shown}`).join(' · ') ||
                      `none in ${limitText(PROPERTIES_RANGE_K[0], temperature)} – Tλ`}</span>
                </>
              )}
            </dd>
          </div>
          <div className="key-figure">
            <dt>Speed {speedLabel}</dt>
            <dd>
              <span className="key-figure__value" data-testid="speed">
                {formatSignificant(speed_m_s)}
              </span>{' '}
              <span className="key-figure__unit">m/s ± {formatSignificant(speedSd_m_s, 2)}</span>
              <span className="key-figure__detail">relative sd {formatSignificant((speedSd_m_s / speed_m_s) * 100, 2)} %</span>
            </dd>
          </div>
          <div className="key-figure">
            <dt>How chosen</dt>
            <dd className="choice-reason">{choice.problem ?? (choice.index === null ? undecided(candidates.length, rule === null, choice.reason) : `${sentenceCase(choice.reason)}.`)}</dd>
          </div>
        </dl>
        {warnings.length > 0 ? (
          <ul className="reading-warnings" aria-label="Cautions about this reading">
            {warnings.map((w) => (
              <li key={w.code} className={`reading-warning reading-warning--${w.severity}`} data-code={w.code}>
                <strong>{w.severity === 'info' ? 'Note' : 'Caution'}:</strong> {w.message}
              </li>
            ))}
          </ul>
        ) : null}
        {children}
        <CandidatesTable candidates={candidates} rule={rule} choice={choice} caption={`Every temperature with u₂ = ${formatSignificant(speed_m_s)} m/s, coldest first`} />
      </section>
      <PanelErrorBoundary panel="u₂ chart">
        <SpeedChart id={chartId} speed_m_s={speed_m_s} speedSd_m_s={speedSd_m_s} candidates={candidates} chosen={choice.index} rule={rule} />
      </PanelErrorBoundary>
    </>
  );
}

function undecided(count: number, noRule: boolean, reason: string): string {
  if (count === 0) return 'Nothing to choose.';
  if (noRule) return count === 1 ? 'Only one temperature has this speed.' : 'Not chosen: give a vapour pressure, an expected temperature or a range.';
  return `Not decided: ${reason}.`;
}

function sentenceCase(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
