/** Messages between the solver pool (main thread) and its workers. Everything here is structured-cloneable. */
import type { EncodedModel, ModelData } from 'highs';
import type { Roster, RosterProblem } from '../problem';
import type { SolveProgress } from '../result';
import type { MipRunOptions, MipRunResult } from '../solve/run-mip';
import type { RosterSolveResult, SolveRosterOptions } from '../solve/solve';

/** Solve options that can cross a thread boundary (no functions, no signals). */
export type PortableRosterOptions = Omit<
  SolveRosterOptions,
  'onProgress' | 'signal' | 'cancelFlag' | 'session' | 'onRoster' | 'incomingRoster'
>;
export type PortableMipOptions = Omit<
  MipRunOptions,
  'onProgress' | 'signal' | 'cancelFlag' | 'clockStart' | 'onSolution'
>;

export type WorkerTask =
  | {
      kind: 'roster';
      problem: RosterProblem;
      options: PortableRosterOptions;
      /** Send every better roster to the pool and take rosters offered back (portfolio members). */
      shareRosters?: boolean;
    }
  | { kind: 'mip'; model: ModelData | EncodedModel; options: PortableMipOptions };

export type WorkerResult = RosterSolveResult | MipRunResult;

export interface TaskMessage {
  type: 'task';
  id: number;
  task: WorkerTask;
  /** Int32Array over this buffer; element 0 set to 1 asks the solve to stop and keep its incumbent. */
  cancelBuffer: SharedArrayBuffer;
}

/** A roster found by another solve of the same problem, offered to a running roster task. */
export interface RosterOfferMessage {
  type: 'roster';
  id: number;
  roster: Roster;
  objective: number;
}

/** What the pool sends to a worker. */
export type PoolMessage = TaskMessage | RosterOfferMessage;

export interface WorkerErrorInfo {
  name: string;
  message: string;
  /** The WebAssembly instance failed (abort, out of memory); the worker replaced it. */
  wasmFailure: boolean;
}

export type WorkerMessage =
  | { type: 'ready' }
  | { type: 'startFailed'; error: WorkerErrorInfo }
  | { type: 'progress'; id: number; progress: SolveProgress }
  /** A roster task found a better roster that meets every hard rule. */
  | { type: 'roster'; id: number; roster: Roster; objective: number }
  | { type: 'done'; id: number; result: WorkerResult; memoryBytes: number }
  | { type: 'failed'; id: number; error: WorkerErrorInfo; memoryBytes: number };

export interface WorkerInit {
  wasmModule?: object;
  memoryLimitBytes?: number;
}
