export {
  HighsSession,
  DEFAULT_MEMORY_LIMIT_BYTES,
  isWasmFailure,
  type HighsSessionOptions,
} from './highs-session';
export { solveMip, relativeGap, solverArrays, type MipRunOptions, type MipRunResult } from './run-mip';
export {
  solveRoster,
  assertCheckerAgrees,
  SolverCheckError,
  type RosterSolveResult,
  type SolveRosterOptions,
} from './solve';
