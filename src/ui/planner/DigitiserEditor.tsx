import { useSekundoStore } from '../store';
import { setTargetKind } from './plan-edits';
import { PLAN_OTHER_HELP } from './planner-help';
import { ChoiceGroup, EditorCard } from './EditorCard';
import { QuantityField } from '../fields/QuantityField';
import { usePlanField } from './use-plan-field';
import { DIGITISER_FIELDS, TARGET_FIELDS } from './plan-fields';

const TARGET_KINDS = [
  { value: 'absolute', label: 'an absolute reading' },
  { value: 'change', label: 'a change between readings' },
] as const;

/** How the signal is recorded, and what the measurement must reach. */
export function DigitiserEditor() {
  const kind = useSekundoStore((s) => s.plannerPlan.targets.temperatureKind);
  const edit = useSekundoStore((s) => s.editPlanner);
  const sampleRate = usePlanField(DIGITISER_FIELDS.sampleRate);
  const recordLength = usePlanField(DIGITISER_FIELDS.recordLength);
  const preTrigger = usePlanField(DIGITISER_FIELDS.preTrigger);
  const snr = usePlanField(TARGET_FIELDS.snr);
  const temperatureSd = usePlanField(TARGET_FIELDS.temperatureSd);
  return (
    <EditorCard id="planner-digitiser" title="Digitiser and targets">
      <div className="plan-grid">
        <QuantityField {...sampleRate} label="Sample rate" />
        <QuantityField {...recordLength} label="Record length" />
        <QuantityField {...preTrigger} label="Pre-trigger" hint="Recorded before the heater pulse starts." />
        <QuantityField {...snr} label="Target SNR" hint="Peak signal over rms noise, averaged." />
        <QuantityField {...temperatureSd} label="Target temperature sd" hint="One sigma, e.g. 1 mK or 50 uK." />
        <ChoiceGroup<'absolute' | 'change'>
          legend="Target is for"
          name="planner-target-kind"
          value={kind}
          options={TARGET_KINDS}
          onChange={(k) => edit('targets.kind', (p) => setTargetKind(p, k))}
          help={PLAN_OTHER_HELP['targets.kind']}
        />
      </div>
    </EditorCard>
  );
}
