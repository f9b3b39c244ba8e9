import { type FormEvent, type ReactNode, useId } from 'react';
import { useSekundoStore } from '../store';
import type { ConverterFieldKey } from './converter-fields';
import { ConverterField } from './ConverterField';

export type SetupPair = 'distance' | 'delay' | 'delaySd' | 'offset';

const PAIRS: Readonly<Record<SetupPair, readonly [ConverterFieldKey, ConverterFieldKey | null]>> = {
  distance: ['distance', 'distanceSd'],
  delay: ['delay', 'delaySd'],
  delaySd: ['delaySd', null],
  offset: ['offset', 'offsetSd'],
};

interface SetupCardProps {
  title: string;
  pairs: readonly SetupPair[];
  /** A line under the title. */
  lead?: ReactNode;
  /** Label of the button that applies every field (Enter does the same). */
  submitLabel?: string;
  children?: ReactNode;
}

/** Value ± sd pairs (distance, delay, offset t₀) in one form: Enter or the button applies them all. */
export function SetupCard({ title, pairs, lead, submitLabel = 'Apply', children }: SetupCardProps) {
  const headingId = useId();
  const commit = useSekundoStore((s) => s.commitConverterField);
  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    for (const pair of pairs) for (const key of PAIRS[pair]) if (key) commit(key);
  };
  return (
    <section className="card converter-card" aria-labelledby={headingId}>
      <h2 id={headingId} className="card-title">
        {title}
      </h2>
      {lead ? <p className="muted converter-card__lead">{lead}</p> : null}
      <form className="setup-form" onSubmit={submit} noValidate>
        {pairs.map((pair) => {
          const [value, sd] = PAIRS[pair];
          return (
            <div key={pair} className="value-sd">
              <ConverterField fieldKey={value} />
              {sd ? (
                <>
                  <span className="value-sd__pm" aria-hidden="true">
                    ±
                  </span>
                  <ConverterField fieldKey={sd} label="sd (1σ)" />
                </>
              ) : null}
            </div>
          );
        })}
        <div className="setup-form__actions">
          <button type="submit" className="button button--primary">
            {submitLabel}
          </button>
          <span className="field-hint">Enter in any field applies it; units may be typed too (“2.5 ms”).</span>
        </div>
      </form>
      {children}
    </section>
  );
}
