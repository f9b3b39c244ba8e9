import { useEffect, useState } from 'react';
import type { LocateOptionsInput, LocateRowInput } from './locate-inputs';
import { deriveLocate, type LocateOutcome } from './derive-locate';
import { useSekundoStore } from '../store';

/** The last few inputs and their outcomes: every panel (and the deferred map) reads the same fit, computed once per change. */
let recent: { rows: readonly LocateRowInput[]; options: LocateOptionsInput; outcome: LocateOutcome }[] = [];
const KEEP = 3;

/** The fit for the given inputs, reusing a recent one when the inputs are the same objects. */
export function locateOutcomeFor(rows: readonly LocateRowInput[], options: LocateOptionsInput): LocateOutcome {
  const hit = recent.find((e) => e.rows === rows && e.options === options);
  if (hit) return hit.outcome;
  const outcome = deriveLocate(rows, options);
  recent = [{ rows, options, outcome }, ...recent].slice(0, KEEP);
  return outcome;
}

/** The located source (or why there is none), derived from the store's inputs. */
export function useLocateOutcome(): LocateOutcome {
  const rows = useSekundoStore((s) => s.locateRows);
  const options = useSekundoStore((s) => s.locateOptions);
  return locateOutcomeFor(rows, options);
}


/** `value` once it has stayed the same for `delay_ms` (the first value at once): costly maps wait for typing to pause. */
export function useSettled<T>(value: T, delay_ms: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    if (Object.is(value, settled)) return;
    const timer = setTimeout(() => setSettled(value), delay_ms);
    return () => clearTimeout(timer);
  }, [value, settled, delay_ms]);
  return settled;
}
