import { type PlanFile, planBath } from '../../io/plan-file';
import { vapourPressure } from '../../physics';
import { formatSignificant } from '../units/format-number';
import { useSekundoStore } from '../store';
import { formatKelvin } from '../units/temperature-text';
import { ChoiceGroup, EditorCard } from './EditorCard';
import { QuantityField } from '../fields/QuantityField';
import { PlanControlMessage } from './PlanControlMessage';
import { usePlanField } from './use-plan-field';
import { type BathMode, bathMode, setBathMode } from './plan-edits';
import { BATH_FIELDS } from './plan-fields';
import { PLAN_OTHER_HELP } from './planner-help';

const MODES = [
  { value: 'temperature', label: 'Temperature' },
  { value: 'pressure', label: 'Vapour-pressure reading' },
] as const;

/** The bath: its temperature, typed or read as the vapour pressure over it, and the liquid depth. */
export function BathEditor() {
  // The bath only: an edit elsewhere in the plan leaves it (and this card) as it is.
  const bath = useSekundoStore((s) => s.plannerPlan.bath);
  const edit = useSekundoStore((s) => s.editPlanner);
  const mode = bathMode({ bath });
  const temperature = usePlanField(BATH_FIELDS.temperature);
  const pressure = usePlanField(BATH_FIELDS.vapourPressure);
  const depth = usePlanField(BATH_FIELDS.liquidDepth);
  return (
    <EditorCard id="planner-bath" title="Bath">
      <div className="plan-grid">
        <ChoiceGroup<BathMode>
          legend="Give the bath as"
          name="planner-bath-mode"
          value={mode}
          options={MODES}
          onChange={(m) => edit('bath.mode', (p) => setBathMode(p, m))}
          help={PLAN_OTHER_HELP['bath.mode']}
        />
        <PlanControlMessage controlKey="bath.mode" />
        {mode === 'temperature' ? (
          <QuantityField {...temperature} label="Bath temperature" hint={temperatureHint(bath)} />
        ) : (
          <QuantityField {...pressure} label="Vapour pressure over the bath" hint={pressureHint(bath)} />
        )}
        <QuantityField {...depth} label="Liquid above the setup" hint="Adds a hydrostatic head; He II stays isothermal." />
      </div>
    </EditorCard>
  );
}

function temperatureHint(bath: PlanFile['bath']): string {
  const T = bath.temperature_K;
  if (T === undefined) return 'K or mK';
  try {
    return `K or mK · saturated vapour pressure ${formatSignificant(vapourPressure(T).pressure_Pa)} Pa`;
  } catch {
    return 'K or mK · no vapour-pressure scale at this temperature';
  }
}

function pressureHint(bath: PlanFile['bath']): string {
  try {
    const read = planBath({ bath });
    return `Pa, kPa, mbar or torr · T = ${formatKelvin(read.temperature_K)} K (${read.scale ?? 'as typed'})`;
  } catch {
    return 'Pa, kPa, mbar or torr';
  }
}
