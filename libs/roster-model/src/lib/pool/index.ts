export {
  SolverPool,
  SolverError,
  sharedSolverPool,
  mergeRosterResults,
  type PoolRosterOptions,
  type SolverErrorKind,
  type SolverPoolOptions,
  type TaskControls,
  type TaskHandle,
} from './solver-pool';
