/**
 * Messages between the page and the rehearsal worker (rehearse-worker.ts). The plan travels as its
 * file form (plain data); the worker turns it into the kernel's input itself.
 */
import type { PlanFile } from '../../../io/plan-file';
import type { RehearsalOptions, RehearsalResult } from '../../../io/rehearse-run';

export type RehearseRequest =
  | { type: 'run'; id: number; plan: PlanFile; options: RehearsalOptions }
  /** One trial's record as a trace CSV file (0-based trial). */
  | { type: 'record'; id: number; plan: PlanFile; options: RehearsalOptions; trial: number };

export type RehearseResponse =
  | { type: 'progress'; id: number; done: number; total: number }
  | { type: 'done'; id: number; result: RehearsalResult }
  | { type: 'record'; id: number; fileName: string; text: string }
  | { type: 'failed'; id: number; message: string };

/** The page's end of the worker: post, listen, hear of a crash, and stop it (a cancel). */
export interface RehearsePort {
  post(message: RehearseRequest): void;
  listen(handler: (message: RehearseResponse) => void): void;
  onFailure(handler: (message: string) => void): void;
  stop(): void;
}
