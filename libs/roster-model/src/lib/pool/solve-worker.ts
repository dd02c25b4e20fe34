/**
 * Body of one solver worker thread: keeps a warm HiGHS session and runs one task at a time.
 * Started by SolverPool, from compiled JavaScript in production or through tsx from the
 * TypeScript sources in tests and development.
 */
import { parentPort, workerData } from 'node:worker_threads';
import type { SolveProgress } from '../result';
import { HighsSession, isWasmFailure } from '../solve/highs-session';
import { runMip } from '../solve/run-mip';
import { solveRoster } from '../solve/solve';
import type { Roster } from '../problem';
import type {
  PoolMessage,
  TaskMessage,
  WorkerErrorInfo,
  WorkerInit,
  WorkerMessage,
  WorkerResult,
} from './protocol';

if (!parentPort) throw new Error('solve-worker must run in a worker thread');
const port = parentPort;
const init = (workerData ?? {}) as WorkerInit;
const send = (message: WorkerMessage): void => port.postMessage(message);

function errorInfo(err: unknown): WorkerErrorInfo {
  const wasmFailure = isWasmFailure(err);
  const message = err instanceof Error ? err.message : String(err);
  return {
    name: err instanceof Error ? err.name : 'Error',
    message:
      wasmFailure && !message.startsWith('The solver failed inside WebAssembly')
        ? `The solver failed inside WebAssembly (${message}); its instance was replaced.`
        : message,
    wasmFailure,
  };
}

async function main(): Promise<void> {
  let session: HighsSession;
  try {
    session = await HighsSession.create({
      wasmModule: init.wasmModule,
      memoryLimitBytes: init.memoryLimitBytes,
    });
  } catch (err) {
    send({ type: 'startFailed', error: errorInfo(err) });
    return;
  }
  let queue = Promise.resolve();
  port.on('message', (message: PoolMessage) => {
    if (message.type === 'roster') {
      // Keep only the best offer for the running task; the solve takes it between rounds. An offer
      // that arrives after its task has ended is dropped.
      if (message.id !== runningId) return;
      const current = offers.get(message.id);
      if (!current || message.objective < current.objective) offers.set(message.id, message);
      return;
    }
    // One task at a time: the pool never sends a second one before the first is answered.
    queue = queue.then(() => runTask(session, message));
  });
  send({ type: 'ready' });
}

/** Rosters offered by other solves of the same problem, per task id, until the task takes them. */
const offers = new Map<number, { roster: Roster; objective: number }>();
/** Id of the task being solved, or null between tasks. */
let runningId: number | null = null;

async function runTask(session: HighsSession, { id, task, cancelBuffer }: TaskMessage): Promise<void> {
  const cancelFlag = new Int32Array(cancelBuffer);
  runningId = id;
  const onProgress = (progress: SolveProgress): void => send({ type: 'progress', id, progress });
  try {
    await session.ensureHealthy();
    let result: WorkerResult;
    if (task.kind === 'roster') {
      result = await solveRoster(task.problem, {
        ...task.options,
        session,
        cancelFlag,
        onProgress,
        ...(task.shareRosters
          ? {
              onRoster: (roster: Roster, objective: number) =>
                send({ type: 'roster', id, roster, objective }),
              incomingRoster: () => {
                const offer = offers.get(id);
                offers.delete(id);
                return offer?.roster ?? null;
              },
            }
          : {}),
      });
    } else {
      result = runMip(session, task.model, { ...task.options, cancelFlag, onProgress });
    }
    send({ type: 'done', id, result, memoryBytes: session.memoryBytes });
  } catch (err) {
    if (isWasmFailure(err)) session.markBroken();
    send({ type: 'failed', id, error: errorInfo(err), memoryBytes: session.memoryBytes });
  }
  runningId = null;
  offers.delete(id);
  // Replace a damaged or bloated instance now, while idle, rather than at the start of the next solve.
  try {
    await session.ensureHealthy();
  } catch {
    // The next task will try again and report the error.
  }
}

void main();
