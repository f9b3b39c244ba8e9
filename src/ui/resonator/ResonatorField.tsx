import { QuantityField } from '../fields';
import { useSekundoStore } from '../store';
import { RESONATOR_FIELDS, type ResonatorFieldKey } from './resonator-fields';

/** One typed input of the resonator view, through the page's one quantity field. */
export function ResonatorField({ name, label, className }: { name: ResonatorFieldKey; label?: string; className?: string }) {
  const value = useSekundoStore((s) => s.resonatorInputs[name]);
  const set = useSekundoStore((s) => s.setResonatorInput);
  const spec = RESONATOR_FIELDS[name];
  return (
    <QuantityField
      fieldKey={`resonator.${name}`}
      spec={spec}
      value={value}
      {...(label ? { label } : {})}
      {...(className ? { className } : {})}
      apply={(v) => {
        if (v === null && spec.blank === undefined) return `${spec.label} needs a value.`;
        set(name, v as never);
        return null;
      }}
    />
  );
}
