import { PanelErrorBoundary } from '../layout/PanelErrorBoundary';
import { useSekundoStore } from '../store';
import { BatchMode } from './BatchMode';
import type { ConverterMode } from './converter-slice';
import { ReadingMode } from './ReadingMode';
import { Segmented } from './Segmented';
import { TraceMode } from './trace/TraceMode';

const MODES: readonly { value: ConverterMode; label: string }[] = [
  { value: 'reading', label: 'One reading' },
  { value: 'batch', label: 'Batch file' },
  { value: 'trace', label: 'Trace lab' },
];

/**
 * The converter: a second-sound delay → every temperature it can mean, each with its uncertainty,
 * and the one the evidence favours. Three ways in: a reading typed by hand, a CSV of delays, or
 * digitiser traces in which the arrival is picked.
 */
export function ConverterView() {
  const mode = useSekundoStore((s) => s.converterMode);
  const setMode = useSekundoStore((s) => s.setConverterMode);
  return (
    <div className="converter">
      <Segmented label="Converter mode" options={MODES} value={mode} onChange={setMode} panelId="converter-mode-panel" idPrefix="converter-mode" />
      <div id="converter-mode-panel" role="tabpanel" aria-labelledby={`converter-mode-${mode}`} className="converter-mode">
        <PanelErrorBoundary panel={`${MODES.find((m) => m.value === mode)?.label ?? 'converter'} mode`}>
          {mode === 'reading' ? <ReadingMode /> : mode === 'batch' ? <BatchMode /> : <TraceMode />}
        </PanelErrorBoundary>
      </div>
    </div>
  );
}
