import type { HeliumProperties } from '../../physics';
import { formatMeasured } from '../units/format-measured';
import { formatSignificant } from '../units/format-number';

interface KeyFigureProps {
  label: string;
  value: string;
  unit: string;
  detail?: string;
}

function KeyFigure({ label, value, unit, detail }: KeyFigureProps) {
  return (
    <div className="key-figure">
      <dt>{label}</dt>
      <dd>
        <span className="key-figure__value">{value}</span> <span className="key-figure__unit">{unit}</span>
        {detail ? <span className="key-figure__detail">{detail}</span> : null}
      </dd>
    </div>
  );
}

/** The three numbers a second-sound experiment starts from, large. */
export function KeyFigures({ properties: p }: { properties: HeliumProperties }) {
  const u2 = p.secondSound_m_s;
  const sd = p.secondSoundSd_m_s;
  // u₂ to the digit its sd supports.
  const measured = u2 === null ? null : formatMeasured(u2, sd);
  return (
    <dl className="key-figures" aria-label="Key figures">
      <KeyFigure
        label="Second sound u₂"
        value={measured === null ? 'none' : measured.value}
        unit={u2 === null ? 'in He I' : 'm/s'}
        detail={measured?.sd ? `± ${measured.sd} m/s` : undefined}
      />
      <KeyFigure label="First sound u₁" value={formatSignificant(p.firstSound_m_s)} unit="m/s" />
      <KeyFigure label="Superfluid fraction ρs/ρ" value={formatSignificant(p.superfluidFraction)} unit="" />
    </dl>
  );
}
