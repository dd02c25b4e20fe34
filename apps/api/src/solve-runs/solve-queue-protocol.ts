/**
 * What the API and the solver workers (`npm run worker`) exchange through Redis when REDIS_URL is
 * set: the BullMQ queue of solves, a channel of solve events (progress, started) and a channel of
 * controls (cancel, stop at once). Plain Node: the worker process loads it without NestJS.
 */
import type { RosterProblem, RosterSolveResult } from '@rotaplex/roster-model';
import { deserialize, serialize } from 'node:v8';

/** BullMQ queue of solves; the job id is the solve run's id. */
export const SOLVE_QUEUE = 'solve-runs';
/** BullMQ queue of the scheduled maintenance jobs, run once across API instances. */
export const MAINTENANCE_QUEUE = 'maintenance';

export interface SolveJobData {
  runId: string;
  /** Instance id of the API process that started the run and saves its result. */
  owner: string;
  /** The roster problem, v8-serialised and base64-encoded (the same structured clone a worker thread gets). */
  problem: string;
  timeLimitSeconds: number;
  /** When the API queued the job (ms since the epoch). */
  queuedAt: number;
}

/** What a solver worker returns for a job (encoded with {@link encodeValue}). */
export interface SolveJobResult {
  /** The run was cancelled: the result (if any) is the best roster found until then. */
  cancelled: boolean;
  /** Null when the run was cancelled before the solve began. */
  result: RosterSolveResult | null;
  worker: string;
  /** When the worker began the solve (ms since the epoch). */
  startedAt: number;
}

/** On the events channel: what every API instance forwards to its listeners. */
export interface SolveEventMessage {
  runId: string;
  event: 'started' | 'progress' | 'status' | 'end';
  data: unknown;
}

/** On the control channel: stop a running solve gently (keeping its roster) or at once. */
export interface SolveControlMessage {
  runId: string;
  action: 'cancel' | 'kill';
}

export const solveEventsChannel = (prefix: string): string => `${prefix}:solve-events`;
export const solveControlChannel = (prefix: string): string => `${prefix}:solve-control`;
/** Set when a run is cancelled, so a worker that takes the job afterwards does not solve it. */
export const solveCancelKey = (prefix: string, runId: string): string => `${prefix}:solve-cancel:${runId}`;
/**
 * The instance id of the API process that owns a queued run (set when it queues the job, refreshed
 * with its heartbeat, deleted when the run ends): the other instances read every owner in one MGET
 * instead of fetching each job with its encoded problem.
 */
export const solveOwnerKey = (prefix: string, runId: string): string => `${prefix}:solve-owner:${runId}`;
/** Alive while the API instance runs (refreshed every few seconds). */
export const apiInstanceKey = (prefix: string, instanceId: string): string =>
  `${prefix}:api-instance:${instanceId}`;
/** Solver workers name their BullMQ worker with this prefix (health counts them). */
export const SOLVER_WORKER_NAME_PREFIX = 'solver-';

/** Structured clone as text (BullMQ stores JSON; v8 keeps what JSON would lose, e.g. Infinity, undefined). */
export function encodeValue(value: unknown): string {
  return serialize(value).toString('base64');
}

export function decodeValue<T>(text: string): T {
  return deserialize(Buffer.from(text, 'base64')) as T;
}

export type { RosterProblem };
