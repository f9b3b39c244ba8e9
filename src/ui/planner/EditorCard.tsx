import type { ReactNode } from 'react';
import { type HelpTopic, useFieldHelp } from '../help/FieldHelp';
import { PanelErrorBoundary } from '../layout/PanelErrorBoundary';
import { symbolCase } from '../layout/symbol-case';

/** A titled group of plan inputs in its own error boundary. */
export function EditorCard({ id, title, children, aside }: { id: string; title: string; children: ReactNode; aside?: ReactNode }) {
  const titleId = `${id}-title`;
  return (
    <section className="card plan-card" aria-labelledby={titleId}>
      <div className="card-head">
        <h3 id={titleId} className="card-title">
          {symbolCase(title)}
        </h3>
        {aside}
      </div>
      <PanelErrorBoundary panel={`${title.toLowerCase()} editor`}>{children}</PanelErrorBoundary>
    </section>
  );
}

/** Two or three choices as a row of radio buttons (a labelled group), with the group's help. */
export function ChoiceGroup<T extends string>({
  legend,
  name,
  value,
  options,
  onChange,
  help,
}: {
  legend: string;
  name: string;
  value: T;
  options: readonly { value: T; label: string }[];
  onChange: (value: T) => void;
  help: HelpTopic;
}) {
  const groupHelp = useFieldHelp(legend.toLowerCase(), help);
  return (
    <fieldset className="plan-choices">
      <legend className="visually-hidden">{legend}</legend>
      {/* The visible legend, beside its "?" (a button inside the legend would join the group's name). */}
      <div className="field-head">
        <span className="plan-field__label" aria-hidden="true">
          {legend}
        </span>
        {groupHelp.button}
      </div>
      {groupHelp.panel}
      <div className="plan-choices__row">
        {options.map((option) => (
          <label key={option.value} className="plan-choice">
            <input
              type="radio"
              name={name}
              value={option.value}
              checked={value === option.value}
              aria-describedby={groupHelp.describedBy}
              onChange={() => onChange(option.value)}
            />
            {option.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
