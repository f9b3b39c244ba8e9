/**
 * Messages between the locate view and its worker (locate-worker.ts): the rows and options to fit,
 * and the outcome. Ids rise; only the answer to the newest request is shown (latest wins).
 */
import type { LocateOutcome } from './derive-locate';
import type { LocateOptionsInput, LocateRowInput } from './locate-inputs';

export interface LocateRequest {
  id: number;
  rows: readonly LocateRowInput[];
  options: LocateOptionsInput;
}

export interface LocateReply {
  id: number;
  outcome: LocateOutcome;
}
