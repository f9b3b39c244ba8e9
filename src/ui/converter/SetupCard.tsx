import { type FormEvent, type ReactNode, useId } from 'react';
import { QuantityField } from '../fields/QuantityField';
import { useSekundoStore } from '../store';
import { type ConverterFieldKey, converterFieldKey } from './converter-fields';
import { useConverterField } from './use-converter-field';
import { symbolCase } from '../layout/symbol-case';
import { InPageForm } from '../fields/OwnForm';

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
  /** Label of the button that shows every good value as applied (values apply as they are typed). */
  submitLabel?: string;
  children?: ReactNode;
}

/**
 * Value ± sd pairs (distance, delay, offset t₀) in one form. Good values apply as they are typed;
 * the button (or Enter) shows each good value as applied, and leaves refused texts with their messages.
 */
export function SetupCard({ title, pairs, lead, submitLabel = 'Apply', children }: SetupCardProps) {
  const headingId = useId();
  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const { fieldDrafts, dropFieldDraft } = useSekundoStore.getState();
    for (const pair of pairs)
      for (const key of PAIRS[pair]) {
        const fieldKey = key && converterFieldKey(key);
        if (fieldKey && fieldDrafts[fieldKey]?.message === null) dropFieldDraft(fieldKey);
      }
  };
  return (
    <section className="card converter-card" aria-labelledby={headingId}>
      <h2 id={headingId} className="card-title">
        {symbolCase(title)}
      </h2>
      {lead ? <p className="muted converter-card__lead">{lead}</p> : null}
      <form className="setup-form" onSubmit={submit} noValidate>
        <InPageForm>
          {pairs.map((pair) => {
            const [value, sd] = PAIRS[pair];
            return <ValueSd key={pair} value={value} sd={sd} />;
          })}
        </InPageForm>
        <div className="setup-form__actions">
          <button type="submit" className="button button--primary">
            {submitLabel}
          </button>
          <span className="field-hint">Values apply as you type; a bare number is in the unit beside it, or type one (“2.5 ms”).</span>
        </div>
      </form>
      {children}
    </section>
  );
}

/** A value and its sd side by side. */
function ValueSd({ value, sd }: { value: ConverterFieldKey; sd: ConverterFieldKey | null }) {
  const valueField = useConverterField(value);
  const sdField = useConverterField(sd ?? value);
  return (
    <div className="value-sd">
      <QuantityField {...valueField} />
      {sd ? (
        <>
          <span className="value-sd__pm" aria-hidden="true">
            ±
          </span>
          <QuantityField {...sdField} shortLabel="sd (1σ)" />
        </>
      ) : null}
    </div>
  );
}
