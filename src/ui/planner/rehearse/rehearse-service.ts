/**
 * What the rehearsal worker does with each request: the plan through the kernel, the rehearsal
 * (src/io/rehearse-run.ts) with progress about a hundred times per run, or one trial's record as
 * a trace CSV file. Runs in the worker, and in the page's thread for component tests.
 */
import { explainPlanError, planFileToInput } from '../../../io/plan-file';
import { recordCsv, recordFileName } from '../../../io/rehearse-csv';
import { rehearse } from '../../../io/rehearse-run';
import { computePlan, PhysicsError, recordModel, syntheticRecord } from '../../../physics';
import type { RehearseRequest, RehearseResponse } from './rehearse-protocol';

/** Progress messages per run, at most. */
const PROGRESS_STEPS = 100;

function message(error: unknown): string {
  if (error instanceof PhysicsError) return explainPlanError(error);
  return error instanceof Error ? error.message : String(error);
}

/** Answers one request through `post`. */
export function handleRehearseRequest(request: RehearseRequest, post: (message: RehearseResponse) => void): void {
  const { id } = request;
  try {
    const input = planFileToInput(request.plan);
    const planned = computePlan(input);
    if (request.type === 'run') {
      const every = Math.max(1, Math.floor(request.options.trials / PROGRESS_STEPS));
      const result = rehearse(input, planned, request.options, {
        progress: (done, total) => {
          if (done % every === 0 || done === total) post({ type: 'progress', id, done, total });
        },
      });
      post({ type: 'done', id, result });
      return;
    }
    const model = recordModel(input, planned, request.options, request.options.seed);
    const text = recordCsv(model, syntheticRecord(model, request.trial), { planName: request.plan.name, trials: request.options.trials, seed: request.options.seed });
    post({ type: 'record', id, fileName: recordFileName(request.trial, request.options.trials), text });
  } catch (error) {
    post({ type: 'failed', id, message: message(error) });
  }
}
