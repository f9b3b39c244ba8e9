import { PanelErrorBoundary } from '../layout/PanelErrorBoundary';
import { useSekundoStore } from '../store';
import { BatchMode } from './BatchMode';
import type { ConverterMode } from './converter-slice';
import { ReadingMode } from './ReadingMode';
import { Segmented } from './Segmented';
import { TraceMode } from './trace/TraceMode';
import { WatchMode } from './watch/WatchMode';

const MODES: readonly { value: ConverterMode; label: string }[] = [
  { value: 'reading', label: 'One reading' },
  { value: 'batch', label: 'Batch file' },
  { value: 'trace', label: 'Trace lab' },
  { value: 'watch', label: 'Follow a folder' },
];

/**
 * The converter: a second-sound delay → every temperature it can mean, each with its uncertainty,
 * and the one the evidence favours. Four ways in: a reading typed by hand, a CSV of delays,
 * digitiser traces in which the arrival is picked, or a folder of traces followed as they arrive.
 */
export function ConverterView() {
  const mode = useSekundoStore((s) => s.converterMode);
  const setMode = useSekundoStore((s) => s.setConverterMode);
  return (
    <div className="converter">
      <Segmented label="Converter mode" options={MODES} value={mode} onChange={setMode} panelId="converter-mode-panel" idPrefix="converter-mode" />
      <div id="converter-mode-panel" role="tabpanel" aria-labelledby={`converter-mode-${mode}`} className="converter-mode">
        <PanelErrorBoundary panel={`${MODES.find((m) => m.value === mode)?.label ?? 'converter'} mode`}>
          {mode === 'reading' ? <ReadingMode /> : mode === 'batch' ? <BatchMode /> : mode === 'trace' ? <TraceMode /> : <WatchMode />}
        </PanelErrorBoundary>
      </div>
    </div>
  );
}
