/**
 * One HiGHS runtime per process or worker thread, kept warm between solves.
 *
 * Why a session and not a bare `loadHighs()` (see /work/shared/design/SOLVER-NOTES.md):
 * - loading costs 40-300 ms, so the runtime is loaded once and reused; the compiled
 *   WebAssembly module is cached (or handed in by the pool) so a fresh instance is cheap;
 * - the first solve after loading is several times slower, so `create()` runs a small warm-up MIP;
 * - an abort inside WebAssembly (RuntimeError) or a failed parse can leave the instance damaged
 *   and leaks memory that is never returned, so after any such error, or when the linear memory
 *   has grown past a limit, the instance is thrown away and a new one is made.
 */
import * as fs from 'node:fs';
import loadHighs, { type EncodedModel, type Highs, type Model, type ModelData } from 'highs';

/** Grow beyond this and the instance is replaced before the next solve (the heap is capped at 2 GiB). */
export const DEFAULT_MEMORY_LIMIT_BYTES = 1024 * 1024 * 1024;

/**
 * A compiled WebAssembly module. The workspace's TypeScript libs (ES2023, no DOM) do not declare the
 * WebAssembly namespace, so the little this file needs is declared here.
 */
export type WasmModule = object;
interface WasmApi {
  compile(bytes: Uint8Array): Promise<WasmModule>;
  RuntimeError: new (...args: never[]) => Error;
}
const wasmApi = (globalThis as unknown as { WebAssembly: WasmApi }).WebAssembly;

let compiledModule: Promise<WasmModule> | null = null;

/** The compiled highs.wasm, compiled once per thread (a WasmModule can also be posted to workers). */
export function compiledHighsModule(): Promise<WasmModule> {
  if (!compiledModule) {
    const wasmPath = require.resolve('highs/runtime');
    compiledModule = wasmApi.compile(fs.readFileSync(wasmPath)).catch((err: unknown) => {
      compiledModule = null;
      throw err;
    });
  }
  return compiledModule;
}

/** True for errors that mean the WebAssembly instance itself may be damaged. */
export function isWasmFailure(err: unknown): boolean {
  if (err instanceof wasmApi.RuntimeError) return true;
  if (err instanceof RangeError && /memory/i.test(err.message)) return true;
  const message = err instanceof Error ? err.message : String(err);
  return /Aborted\(|RuntimeError|out of memory|Cannot enlarge memory/i.test(message);
}

/** A small 0/1 model solved once after loading so later solves run at full speed. */
function warmUpModel(highs: Highs): ModelData {
  // 12 items, one knapsack row and one cardinality row: enough branching to exercise the MIP code.
  const n = 12;
  const weights = [23, 31, 29, 44, 53, 38, 63, 85, 89, 82, 17, 41];
  const values = [92, 57, 49, 68, 60, 43, 67, 84, 87, 72, 33, 54];
  const starts = [0, n, 2 * n];
  const indices = [...Array.from({ length: n }, (_, j) => j), ...Array.from({ length: n }, (_, j) => j)];
  return {
    numCols: n,
    numRows: 2,
    sense: highs.constants.objectiveSense.maximize,
    colCost: values,
    colLower: new Array<number>(n).fill(0),
    colUpper: new Array<number>(n).fill(1),
    rowLower: [-Infinity, -Infinity],
    rowUpper: [165, 6],
    matrix: {
      format: 'csr',
      numRows: 2,
      numCols: n,
      starts,
      indices,
      values: [...weights, ...new Array<number>(n).fill(1)],
    },
    integrality: new Array<0 | 1>(n).fill(1),
  };
}

export interface HighsSessionOptions {
  /** A precompiled highs.wasm (e.g. posted from the pool's main thread). */
  wasmModule?: WasmModule;
  /** Replace the instance when its linear memory grows beyond this many bytes. */
  memoryLimitBytes?: number;
  /** Skip the warm-up solve (tests of the session itself). */
  skipWarmUp?: boolean;
}

export class HighsSession {
  private broken = false;
  /** How many times the instance has been replaced (for logs and tests). */
  recreated = 0;

  private constructor(
    private instance: Highs,
    private readonly wasmModule: WasmModule,
    private readonly options: HighsSessionOptions,
  ) {}

  static async create(options: HighsSessionOptions = {}): Promise<HighsSession> {
    const wasmModule = options.wasmModule ?? (await compiledHighsModule());
    const session = new HighsSession(await loadHighs({ wasmModule }), wasmModule, options);
    if (!options.skipWarmUp) session.warmUp();
    return session;
  }

  /** The loaded runtime; call `ensureHealthy()` before a new solve. */
  get highs(): Highs {
    return this.instance;
  }

  /** Bytes of WebAssembly linear memory currently reserved by the instance. */
  get memoryBytes(): number {
    return this.instance.memoryBytes;
  }

  /** Mark the instance as damaged (after an abort); the next `ensureHealthy()` replaces it. */
  markBroken(): void {
    this.broken = true;
  }

  get needsReplacement(): boolean {
    return (
      this.broken || this.instance.memoryBytes > (this.options.memoryLimitBytes ?? DEFAULT_MEMORY_LIMIT_BYTES)
    );
  }

  /** Replace the instance if it was marked broken or has grown too large. */
  async ensureHealthy(): Promise<void> {
    if (!this.needsReplacement) return;
    this.instance = await loadHighs({ wasmModule: this.wasmModule });
    this.broken = false;
    this.recreated += 1;
    if (!this.options.skipWarmUp) this.warmUp();
  }

  /**
   * Create a model from arrays, run `operation`, and always dispose the model (garbage collection
   * does not free it). A WebAssembly failure marks the session broken and is rethrown.
   */
  withModel<T>(source: ModelData | EncodedModel, operation: (model: Model) => T): T {
    let model: Model | null = null;
    try {
      model = this.instance.createModel(source);
      return operation(model);
    } catch (err) {
      if (isWasmFailure(err)) this.broken = true;
      throw err;
    } finally {
      if (model) {
        try {
          model.dispose();
        } catch {
          // After an abort the instance may refuse even this; it is replaced anyway.
          this.broken = true;
        }
      }
    }
  }

  private warmUp(): void {
    this.withModel(warmUpModel(this.instance), (model) => {
      // Never set `threads`: the wasm build is single-threaded and the option API rejects it.
      model.options.set('output_flag', false);
      model.run();
    });
  }
}
