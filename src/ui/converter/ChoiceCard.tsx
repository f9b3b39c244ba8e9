import { useId } from 'react';
import { type HelpTopic, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import type { ChoiceKind } from './converter-checks';
import { CONVERTER_CHOICE_HELP } from './converter-help';
import { QuantityField } from '../fields/QuantityField';
import { useConverterField } from './use-converter-field';

const OPTIONS: readonly { kind: ChoiceKind; label: string; hint: string }[] = [
  { kind: 'none', label: 'Show all, choose none', hint: 'Every candidate stays undecided.' },
  { kind: 'pressure', label: 'Vapour-pressure reading', hint: 'The candidate nearest the ITS-90 temperature of the bath’s vapour pressure.' },
  { kind: 'expected', label: 'Expected temperature', hint: 'The candidate nearest the temperature you expect.' },
  { kind: 'range', label: 'Temperature range', hint: 'The one candidate inside the range (none if several are).' },
];

/** How to choose among the candidates: a vapour-pressure reading, an expected temperature, or a range. */
/** The ways of choosing that take one value, and that field's name (its label is hidden: the option names it). */
const ONE_FIELD_LABEL = { pressure: 'Vapour pressure', expected: 'Expected temperature' } as const;

export function ChoiceCard({ series = false }: { series?: boolean }) {
  const headingId = useId();
  const name = useId();
  const choice = useSekundoStore((s) => s.converterChoice);
  const setChoice = useSekundoStore((s) => s.setConverterChoice);
  const fields = {
    pressure: useConverterField('pressure', () => setChoice('pressure')),
    expected: useConverterField('expected', () => setChoice('expected')),
    rangeMin: useConverterField('rangeMin', () => setChoice('range')),
    rangeMax: useConverterField('rangeMax', () => setChoice('range')),
  };
  // One help per way of choosing; a field without a visible label is described by its choice's.
  const topics: Record<ChoiceKind, HelpTopic> = {
    none: CONVERTER_CHOICE_HELP.none,
    pressure: fields.pressure.spec.help ?? CONVERTER_CHOICE_HELP.none,
    expected: fields.expected.spec.help ?? CONVERTER_CHOICE_HELP.none,
    range: CONVERTER_CHOICE_HELP.range,
  };
  const help = {
    none: useFieldHelp('show all, choose none', topics.none),
    pressure: useFieldHelp('vapour-pressure reading', topics.pressure),
    expected: useFieldHelp('expected temperature', topics.expected),
    range: useFieldHelp('temperature range', topics.range),
  };
  return (
    <section className="card converter-card" aria-labelledby={headingId}>
      <h2 id={headingId} className="card-title">
        Choose among the candidates
      </h2>
      <p className="muted converter-card__lead">
        {series
          ? 'Decides the first reading; each later one takes the candidate nearest the one before (a row or file with its own vapour pressure starts afresh).'
          : 'One delay can mean up to three temperatures. Say what else you know; the others stay listed with the reason.'}
      </p>
      <fieldset className="choice-options">
        <legend className="visually-hidden">Way of choosing</legend>
        {OPTIONS.map((o) => (
          <div key={o.kind} className={`choice-option${choice === o.kind ? ' is-active' : ''}`}>
            <div className="field-head">
              <label className="choice-option__label">
                <input
                  type="radio"
                  name={name}
                  value={o.kind}
                  checked={choice === o.kind}
                  aria-describedby={help[o.kind].describedBy}
                  onChange={() => setChoice(o.kind)}
                />
                <span>{o.label}</span>
              </label>
              {help[o.kind].button}
            </div>
            {help[o.kind].panel}
            {choice === o.kind ? <p className="field-hint">{o.hint}</p> : null}
            {o.kind === 'pressure' || o.kind === 'expected' ? (
              <QuantityField {...fields[o.kind]} label={ONE_FIELD_LABEL[o.kind]} labelHidden describedBy={help[o.kind].describedBy} className="choice-option__field" />
            ) : null}
            {o.kind === 'range' ? (
              <div className="choice-option__pair choice-option__pair--range">
                <QuantityField {...fields.rangeMin} shortLabel="From" className="choice-option__field" />
                <QuantityField {...fields.rangeMax} shortLabel="To" className="choice-option__field" />
              </div>
            ) : null}
          </div>
        ))}
      </fieldset>
    </section>
  );
}
