import type { FormEvent } from 'react';
import { describedBy, HelpLabel, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { TEMPERATURE_HELP } from './temperature-help';
import { TEMPERATURE_RANGE_TEXT } from '../units/temperature-text';

const INPUT_ID = 'temperature-input';
const HINT_ID = 'temperature-hint';
const ERROR_ID = 'temperature-error';

/** Typed temperature in K or mK; applied on Enter, on "Set" or when the field loses focus. */
export function TemperatureField() {
  const draft = useSekundoStore((state) => state.temperatureDraft);
  const error = useSekundoStore((state) => state.temperatureError);
  const edit = useSekundoStore((state) => state.editTemperatureDraft);
  const commit = useSekundoStore((state) => state.commitTemperatureDraft);
  const help = useFieldHelp('temperature', TEMPERATURE_HELP.field);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    commit();
  };

  return (
    <form className="temperature-form" onSubmit={submit} noValidate>
      <HelpLabel htmlFor={INPUT_ID} help={help}>
Temperature (type K or mK)
</HelpLabel>
      <div className="field-row">
        <input
          id={INPUT_ID}
          className="text-input"
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          value={draft}
          onChange={(event) => edit(event.target.value)}
          onBlur={commit}
          aria-invalid={error !== null}
          aria-describedby={describedBy(error !== null && ERROR_ID, HINT_ID, help.describedBy)}
        />
        <button type="submit" className="button button--primary">
          Set
        </button>
      </div>
      <p id={HINT_ID} className="field-hint">
        For example 1.8, 1.8 K or 1800 mK; press Enter to apply. Range{' '}
        <span className="nowrap">{TEMPERATURE_RANGE_TEXT}</span>.
      </p>
      {error === null ? null : (
        <p id={ERROR_ID} className="field-error" role="alert">
          {error} The temperature in effect is unchanged.
        </p>
      )}
    </form>
  );
}
