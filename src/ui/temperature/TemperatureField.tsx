import { PROPERTIES_RANGE_K } from '../../physics';
import type { FieldSpec } from '../fields/field-spec';
import { QuantityField } from '../fields/QuantityField';
import { useSekundoStore } from '../store';
import { TEMPERATURE_FIELD_KEY } from './temperature-slice';
import { KINDS } from '../units/ladders';
import { TEMPERATURE_RANGE_TEXT } from '../units/temperature-text';
import { TEMPERATURE_HELP } from './temperature-help';

/** The explorer's temperature field: the kernel's property range, in the header's unit of temperature. */
export const TEMPERATURE_FIELD: FieldSpec = { label: 'Temperature', kind: KINDS.temperature, range: PROPERTIES_RANGE_K, help: TEMPERATURE_HELP.field };

/** Typed temperature in the header's unit (K or mK), or with its unit; applied as it is typed. */
export function TemperatureField() {
  const temperature_K = useSekundoStore((s) => s.temperature_K);
  const setTemperature = useSekundoStore((s) => s.setTemperature);
  return (
    <div className="temperature-form">
      <QuantityField
        fieldKey={TEMPERATURE_FIELD_KEY}
        spec={TEMPERATURE_FIELD}
        value={temperature_K}
        apply={(v) => (v === null ? 'Temperature is empty.' : setTemperature(v))}
        label="Temperature"
        hint={
          <>
            For example 1.8 in K, 1800 in mK, or with its unit (“1800 mK”). Range <span className="nowrap">{TEMPERATURE_RANGE_TEXT}</span>.
          </>
        }
      />
    </div>
  );
}
