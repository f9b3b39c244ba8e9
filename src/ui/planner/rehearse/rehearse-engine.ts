/**
 * Runs rehearsals in the worker for the page: one worker at a time, started on demand; a cancel
 * ends it (the run is one long computation, so ending the worker is the way to stop it) and the
 * next request starts a fresh one. Progress and results go to the store's rehearsal slice.
 */
import type { PlanFile } from '../../../io/plan-file';
import type { RehearsalOptions } from '../../../io/rehearse-run';
import { useSekundoStore } from '../../store';
import { createRehearsePort } from './rehearse-port';
import type { RehearsePort, RehearseResponse } from './rehearse-protocol';

let port: RehearsePort | null = null;
let nextId = 1;
let runningId: number | null = null;
const waiting = new Map<number, { resolve: (file: { fileName: string; text: string }) => void; reject: (error: Error) => void }>();

function receive(message: RehearseResponse): void {
  const store = useSekundoStore.getState();
  if (message.type === 'record' || (message.type === 'failed' && waiting.has(message.id))) {
    const w = waiting.get(message.id);
    waiting.delete(message.id);
    if (message.type === 'record') w?.resolve({ fileName: message.fileName, text: message.text });
    else w?.reject(new Error(message.message));
    return;
  }
  if (message.id !== runningId) return;
  if (message.type === 'progress') store.setRehearseRun({ done: message.done, total: message.total });
  else if (message.type === 'done') {
    runningId = null;
    store.setRehearseRun({ status: 'done', done: message.result.trials, result: message.result, message: null });
  } else if (message.type === 'failed') {
    runningId = null;
    store.setRehearseRun({ status: 'failed', message: message.message });
  }
}

function fail(text: string): void {
  port = null;
  for (const w of waiting.values()) w.reject(new Error(text));
  waiting.clear();
  if (runningId !== null) {
    runningId = null;
    useSekundoStore.getState().setRehearseRun({ status: 'failed', message: text });
  }
}

function ensurePort(): RehearsePort {
  if (port) return port;
  const made = createRehearsePort();
  made.listen(receive);
  made.onFailure(fail);
  port = made;
  return made;
}

/** Starts a rehearsal of `plan` (a run in progress is stopped first). */
export function startRehearsal(plan: PlanFile, options: RehearsalOptions): void {
  if (runningId !== null) cancelRehearsal();
  const id = nextId++;
  runningId = id;
  useSekundoStore.getState().setRehearseRun({ status: 'running', done: 0, total: options.trials, result: null, plan, options, message: null });
  try {
    ensurePort().post({ type: 'run', id, plan, options });
  } catch (error) {
    fail(error instanceof Error ? error.message : String(error));
  }
}

/** Stops the run in progress: its worker ends; what was shown before stays away (nothing half-done is shown). */
export function cancelRehearsal(): void {
  if (runningId === null) return;
  runningId = null;
  port?.stop();
  port = null;
  for (const w of waiting.values()) w.reject(new Error('cancelled'));
  waiting.clear();
  useSekundoStore.getState().setRehearseRun({ status: 'cancelled' });
}

/** One trial's record (0-based) as a trace CSV file, made in the worker. */
export function requestRecordFile(plan: PlanFile, options: RehearsalOptions, trial: number): Promise<{ fileName: string; text: string }> {
  const id = nextId++;
  return new Promise((resolve, reject) => {
    waiting.set(id, { resolve, reject });
    try {
      ensurePort().post({ type: 'record', id, plan, options, trial });
    } catch (error) {
      waiting.delete(id);
      reject(error instanceof Error ? error : new Error(String(error)));
    }
  });
}
