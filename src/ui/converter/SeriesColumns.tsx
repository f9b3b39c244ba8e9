import type { ReactNode } from 'react';
import type { TemperatureCandidate } from '../../physics';
import { formatSignificant } from '../units/format-number';
import type { UnitViews } from '../units/unit-views';

type TemperatureView = UnitViews['temperature'];

/** Every candidate's temperature, each to the digit its sd supports, "*" marking an extremum: "1.232 · 1.41 · 1.785". */
export function candidateList(candidates: readonly TemperatureCandidate[], temperature: TemperatureView): string {
  return candidates.map((x) => `${temperature.measured(x.temperature_K, x.sd_K).value}${x.kind === 'extremum' ? '*' : ''}`).join(' · ');
}

/** The column heads a batch and a trace series share: speed, the chosen temperature and its sd, how it was chosen, every candidate. */
export function SeriesHeads({ temperature }: { temperature: TemperatureView }) {
  return (
    <>
      <th scope="col" className="num">
        Speed (m/s)
      </th>
      <th scope="col" className="num">
        T ({temperature.shown})
      </th>
      <th scope="col" className="num">
        sd ({temperature.shown})
      </th>
      <th scope="col" className="num" title="Every temperature whose u₂ lies within 1.96 σ of the speed, on the chosen candidate's stretch of the curve">
        95 % interval ({temperature.shown})
      </th>
      <th scope="col">Chosen by</th>
      <th scope="col">
        All candidates ({temperature.shown})
      </th>
    </>
  );
}

interface SeriesCellsProps {
  /** The reading's speed and its sd, m/s; null when it has none. */
  speed: { value_m_s: number; sd_m_s: number } | null;
  /** The reading's candidates (null: no conversion) and the index of the chosen one. */
  candidates: readonly TemperatureCandidate[] | null;
  chosen: number | null;
  /** What the "Chosen by" cell says. */
  chosenBy: ReactNode;
  temperature: TemperatureView;
  /** Past a turn of u₂: the two continuations (indices into `candidates`) and the labelled trend guess. */
  ambiguous?: { alternatives: readonly [number, number]; guess: number } | null;
}

/** A 95 % interval as "low – high" in the display unit, with the turn it runs across. */
export function intervalText(c: TemperatureCandidate, temperature: TemperatureView): string {
  const [lo, hi] = c.interval95_K;
  const turn = c.reaches95.filter((r) => r === 'minimum' || r === 'maximum');
  return `${temperature.measured(lo, c.sd_K).value} – ${temperature.measured(hi, c.sd_K).value}${turn.length > 0 ? ` (across the ${turn.join(' and ')})` : ''}`;
}

/** A reading's cells under {@link SeriesHeads}: the chosen temperature and its sd rounded together, in the display unit. */
export function SeriesCells({ speed, candidates, chosen, chosenBy, temperature, ambiguous = null }: SeriesCellsProps) {
  const c = chosen === null ? undefined : candidates?.[chosen];
  const T = c ? temperature.measured(c.temperature_K, c.sd_K) : null;
  const along = ambiguous ? candidates?.[ambiguous.alternatives[0]] : undefined;
  const across = ambiguous ? candidates?.[ambiguous.alternatives[1]] : undefined;
  const shown = (x: TemperatureCandidate) => temperature.measured(x.temperature_K, x.sd_K).value;
  return (
    <>
      <td className="num">{speed ? `${formatSignificant(speed.value_m_s)} ± ${formatSignificant(speed.sd_m_s, 2)}` : '—'}</td>
      <td className="num value">
        {T ? (
          T.value
        ) : along && across ? (
          <span className="ambiguous-pair" title="Past a turn of u₂ continuity cannot choose: both continuations are kept">
            {shown(along)} or {shown(across)}
            <span className="muted"> (guess: {shown(across)})</span>
          </span>
        ) : (
          '—'
        )}
      </td>
      <td className="num uncertainty">{T?.sd ?? ''}</td>
      <td className="num">{c ? intervalText(c, temperature) : ''}</td>
      <td>{chosenBy}</td>
      <td className="candidate-list">{candidates === null ? '' : candidateList(candidates, temperature) || 'none'}</td>
    </>
  );
}
