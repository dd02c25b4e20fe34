export {
  HighsSession,
  DEFAULT_MEMORY_LIMIT_BYTES,
  isWasmFailure,
  type HighsSessionOptions,
} from './highs-session';
export { solveMip, relativeGap, solverArrays, type MipRunOptions, type MipRunResult } from './run-mip';
export { solveRoster, type RosterSolveResult, type SolveRosterOptions } from './solve';
export { assertCheckerAgrees, SolverCheckError } from './agreement';
export {
  AUTO_LARGE_MODEL_X,
  AUTO_FIX_AND_OPTIMISE_SHARE,
  AUTO_FIX_AND_OPTIMISE_SHARE_SMALL,
  AUTO_SEARCH_SHARE,
  AUTO_LARGE_HIGHS_OPTIONS,
} from './policy';
