/**
 * Picks and samples asked of the worker, kept by what they were asked with (file id and picker
 * options), so each is computed once and a change of options asks again. These are derived
 * results, not inputs: they live here, outside the store, and components read them with hooks.
 */
import { useEffect, useMemo, useState, useSyncExternalStore } from 'react';
import type { TracePick, TracePickOptions } from '../../../io/trace-pick';
import type { PickerKind } from '../../../physics';
import type { Polarity } from './trace-protocol';
import { traceEngine } from './trace-engine';
import type { TraceSamples } from './trace-protocol';

export type PickState = { status: 'picking' } | { status: 'picked'; pick: TracePick } | { status: 'failed'; message: string };

const picks = new Map<string, PickState>();
const listeners = new Set<() => void>();
let version = 0;

function notify(): void {
  version += 1;
  for (const l of listeners) l();
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** The key of a pick: the file and every option that changes it. */
export function pickKey(id: string, options: TracePickOptions): string {
  return `${id}|${JSON.stringify(options)}`;
}

function request(id: string, options: TracePickOptions): void {
  const key = pickKey(id, options);
  if (picks.has(key)) return;
  picks.set(key, { status: 'picking' });
  traceEngine()
    .pick(id, options)
    .then(
      (pick) => picks.set(key, { status: 'picked', pick }),
      (error: unknown) => picks.set(key, { status: 'failed', message: error instanceof Error ? error.message : String(error) }),
    )
    .finally(notify);
}

/** Drops every pick (files cleared, tests). */
export function forgetPicks(): void {
  picks.clear();
  notify();
}

/** The picks of the given files with these options, asked for when missing. */
export function usePicks(ids: readonly string[], options: TracePickOptions): ReadonlyMap<string, PickState> {
  const current = useSyncExternalStore(subscribe, () => version);
  const key = ids.join(',');
  const optionsKey = JSON.stringify(options);
  useEffect(() => {
    const parsed = JSON.parse(optionsKey) as TracePickOptions;
    for (const id of key === '' ? [] : key.split(',')) request(id, parsed);
  }, [key, optionsKey]);
  // biome-ignore lint/correctness/useExhaustiveDependencies: `current` is the cache version: a new pick means a new map.
  return useMemo(() => {
    const parsed = JSON.parse(optionsKey) as TracePickOptions;
    const out = new Map<string, PickState>();
    for (const id of key === '' ? [] : key.split(',')) out.set(id, picks.get(pickKey(id, parsed)) ?? { status: 'picking' });
    return out;
  }, [key, optionsKey, current]);
}

/** The picker options from the store's inputs (SI), in the io picker's terms. */
export function pickOptionsOf(input: {
  picker: PickerKind;
  heater: string | null;
  sensor: string | null;
  polarity: Polarity;
  threshold: number | null;
  fraction: number | null;
  from_s: number | null;
  to_s: number | null;
}): TracePickOptions {
  const options: TracePickOptions = { picker: input.picker, polarity: input.polarity };
  if (input.heater !== null) options.heater = input.heater;
  if (input.sensor !== null) options.sensor = input.sensor;
  if (input.picker === 'threshold' && input.threshold !== null) options.thresholdSigma = input.threshold;
  if (input.picker === 'fraction' && input.fraction !== null) options.fraction = input.fraction;
  if (input.from_s !== null) options.from_s = input.from_s;
  if (input.to_s !== null) options.to_s = input.to_s;
  return options;
}

export type SamplesState = { status: 'loading' } | { status: 'ready'; samples: TraceSamples } | { status: 'failed'; message: string } | { status: 'none' };

/** The samples of one file (for drawing), fetched from the worker when the file changes; only one file's are held. */
export function useTraceSamples(id: string | null): SamplesState {
  const [state, setState] = useState<SamplesState>({ status: 'none' });
  useEffect(() => {
    if (id === null) {
      setState({ status: 'none' });
      return;
    }
    let live = true;
    setState({ status: 'loading' });
    traceEngine()
      .samples(id)
      .then(
        (samples) => live && setState({ status: 'ready', samples }),
        (error: unknown) => live && setState({ status: 'failed', message: error instanceof Error ? error.message : String(error) }),
      );
    return () => {
      live = false;
    };
  }, [id]);
  return state;
}
