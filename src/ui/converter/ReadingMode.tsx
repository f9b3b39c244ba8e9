import { useMemo } from 'react';
import { PanelErrorBoundary } from '../layout/PanelErrorBoundary';
import { useSekundoStore } from '../store';
import { ChoiceCard } from './ChoiceCard';
import { valuesOf } from './converter-slice';
import { currentUnitViews } from '../units/unit-views';
import { ConversionResult } from './ConversionResult';
import { DistancesInput, DistancesResult } from './DistancesPanel';
import { tableExport } from './export-text';
import { chooseFor, singleReading, singleReadingTable } from './reading-results';
import type { ReadingMethod } from './converter-slice';
import { Segmented } from './Segmented';
import { SetupCard } from './SetupCard';
import { SweepInput, SweepResult } from './SweepPanel';
import { useFieldValues } from './use-converter';

const METHODS: readonly { value: ReadingMethod; label: string }[] = [
  { value: 'single', label: 'One delay' },
  { value: 'distances', label: 'Several distances' },
  { value: 'sweep', label: 'Path length from a sweep' },
];

/** One reading typed by hand: a delay, delays at several distances, or a sweep that calibrates the path. */
export function ReadingMode() {
  const method = useSekundoStore((s) => s.converterMethod);
  const setMethod = useSekundoStore((s) => s.setConverterMethod);
  return (
    <>
      <Segmented label="What you read" options={METHODS} value={method} onChange={setMethod} panelId="converter-method-panel" idPrefix="converter-method" size="small" />
      <div id="converter-method-panel" role="tabpanel" aria-labelledby={`converter-method-${method}`} className="converter-grid">
        <div className="converter-inputs">
          {method === 'single' ? (
            <SetupCard title="The reading" pairs={['distance', 'delay', 'offset']} submitLabel="Convert" lead="Heater–sensor distance (cold), the delay read off the scope, and the offset t₀ of heater and electronics, each with its one-sigma uncertainty." />
          ) : null}
          {method === 'distances' ? (
            <PanelErrorBoundary panel="distance table">
              <DistancesInput />
            </PanelErrorBoundary>
          ) : null}
          {method === 'sweep' ? (
            <>
              <PanelErrorBoundary panel="sweep input">
                <SweepInput />
              </PanelErrorBoundary>
              <SetupCard title="Offset" pairs={['offset']} lead="Heater and electronics lag t₀, subtracted from the shortest delay." />
            </>
          ) : null}
          {method !== 'sweep' ? (
            <PanelErrorBoundary panel="choice of candidate">
              <ChoiceCard />
            </PanelErrorBoundary>
          ) : null}
        </div>
        <div className="converter-results">
          <PanelErrorBoundary panel="result">
            {method === 'single' ? <SingleResult /> : method === 'distances' ? <DistancesResult /> : <SweepResult />}
          </PanelErrorBoundary>
        </div>
      </div>
    </>
  );
}

/** Export of one delay, built from the inputs at click time. */
function singleExport() {
  const state = useSekundoStore.getState();
  const values = valuesOf(state.converterValues);
  const result = singleReading(values);
  if (!result.ok) return null;
  const units = currentUnitViews();
  const table = singleReadingTable(values, result.value, chooseFor(result.value.candidates, state.converterChoice, values, units.temperature.unit), units);
  return tableExport('sekundo-reading.csv', table);
}

function SingleResult() {
  const values = useFieldValues();
  const kind = useSekundoStore((s) => s.converterChoice);
  const unit = useSekundoStore((s) => s.displayUnits.temperature);
  const result = useMemo(() => singleReading(values), [values]);
  const chosen = useMemo(() => (result.ok ? chooseFor(result.value.candidates, kind, values, unit) : null), [result, kind, values, unit]);
  if (!result.ok || chosen === null) {
    return (
      <p className="card field-error" role="alert">
        {result.ok ? '' : `No conversion: ${result.message}`}
      </p>
    );
  }
  return (
    <ConversionResult
      title="Temperature from this delay"
      chartId="converter-speed"
      speed_m_s={result.value.speed_m_s}
      speedSd_m_s={result.value.speedSd_m_s}
      speedLabel="u = d/(t − t₀)"
      candidates={result.value.candidates}
      chosen={chosen}
      exportContent={singleExport}
    />
  );
}
