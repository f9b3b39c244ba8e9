import { EditorCard } from './EditorCard';
import { PlanNumberField } from './PlanField';
import { DIGITISER_FIELDS, TARGET_FIELDS } from './plan-fields';

/** How the signal is recorded, and what the measurement must reach. */
export function DigitiserEditor() {
  return (
    <EditorCard id="planner-digitiser" title="Digitiser and targets">
      <div className="plan-grid">
        <PlanNumberField field={DIGITISER_FIELDS.sampleRate} label="Sample rate" />
        <PlanNumberField field={DIGITISER_FIELDS.recordLength} label="Record length" />
        <PlanNumberField field={DIGITISER_FIELDS.preTrigger} label="Pre-trigger" hint="Recorded before the heater pulse starts." />
        <PlanNumberField field={TARGET_FIELDS.snr} label="Target SNR" hint="Peak signal over rms noise, averaged." />
        <PlanNumberField field={TARGET_FIELDS.temperatureSd} label="Target temperature sd" hint="One sigma, e.g. 1 mK or 50 uK." />
      </div>
    </EditorCard>
  );
}
