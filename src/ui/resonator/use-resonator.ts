import { useMemo } from 'react';
import { useSekundoStore } from '../store';
import { deriveFit, deriveLockin, derivePlan, deriveReading } from './derive-resonator';

/** The plan, memoised on the inputs. */
export function useResonatorPlan() {
  const inputs = useSekundoStore((s) => s.resonatorInputs);
  return useMemo(() => derivePlan(inputs), [inputs]);
}

/** The sweep's and the reference's fits, memoised on the files. */
export function useResonatorFits() {
  const sweep = useSekundoStore((s) => s.resonatorSweep);
  const reference = useSekundoStore((s) => s.resonatorReference);
  const sweepFit = useMemo(() => deriveFit(sweep?.data ?? null), [sweep]);
  const referenceFit = useMemo(() => deriveFit(reference?.data ?? null), [reference]);
  return { sweep, reference, sweepFit, referenceFit };
}

/** Temperatures and line density of the sweep (null without a good fit). */
export function useResonatorReading() {
  const inputs = useSekundoStore((s) => s.resonatorInputs);
  const { sweepFit, referenceFit } = useResonatorFits();
  return useMemo(() => {
    if (!sweepFit?.ok) return null;
    return deriveReading(inputs, sweepFit.value, referenceFit?.ok ? referenceFit.value : null);
  }, [inputs, sweepFit, referenceFit]);
}

/** The lock-in series against the reference, at the temperature the sweep reading uses (or the bath's). */
export function useResonatorLockin() {
  const inputs = useSekundoStore((s) => s.resonatorInputs);
  const record = useSekundoStore((s) => s.resonatorLockin);
  const { referenceFit } = useResonatorFits();
  const reading = useResonatorReading();
  const T = reading?.bath.temperature_K ?? (inputs.pressure_Pa === null ? inputs.temperature_K : null);
  return useMemo(() => {
    const reference = referenceFit?.ok ? referenceFit.value : null;
    return deriveLockin(inputs, record?.data ?? null, reference, T ?? inputs.temperature_K);
  }, [inputs, record, referenceFit, T]);
}
