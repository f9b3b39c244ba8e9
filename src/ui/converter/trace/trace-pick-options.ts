import { useMemo } from 'react';
import type { TracePickOptions } from '../../../io/trace-pick';
import type { PickerKind } from '../../../physics';
import { useSekundoStore } from '../../store';
import { useFieldValues } from '../use-converter';
import { pickOptionsOf } from './trace-picks';

/** The pickers as the trace lab and the locate view's traces name them. */
export const PICKER_LABELS: Readonly<Record<PickerKind, string>> = {
  threshold: 'Threshold (k noise sd)',
  fraction: 'Fraction of the peak',
  peak: 'Peak (parabola)',
  xcorr: 'Cross-correlation',
};

/** The picker options from the store, as the worker takes them. */
export function useTracePickOptions(): TracePickOptions {
  const picker = useSekundoStore((s) => s.converterTracePicker);
  const heater = useSekundoStore((s) => s.converterTraceHeater);
  const sensor = useSekundoStore((s) => s.converterTraceSensor);
  const polarity = useSekundoStore((s) => s.converterTracePolarity);
  const v = useFieldValues();
  return useMemo(
    () => pickOptionsOf({ picker, heater, sensor, polarity, threshold: v.threshold, fraction: v.fraction, from_s: v.searchFrom, to_s: v.searchTo }),
    [picker, heater, sensor, polarity, v.threshold, v.fraction, v.searchFrom, v.searchTo],
  );
}

