export * from './lib/problem';
export * from './lib/result';
export * from './lib/time';
export { creditLeave } from './lib/leave-credit';
export { MipBuilder, type ColumnMeta, type HighsModelArrays, type RowMeta } from './lib/model/builder';
export { ProblemIndex, ModelContext, type Grid, type RuleModule, type GoalModule } from './lib/model/context';
export { buildModel, type BuildOptions, type BuiltModel } from './lib/model/build-model';
export { RULES } from './lib/rules';
export { GOALS } from './lib/goals';
export { checkRoster } from './lib/check/checker';
export { validateProblem, InvalidProblemError } from './lib/check/validate';
export { construct, improve, type ConstructOptions } from './lib/heuristic/construct';
export {
  fixAndOptimise,
  type FixAndOptimiseOptions,
  type FixAndOptimiseResult,
  type SubMipResult,
  type SubMipSolver,
} from './lib/heuristic/fix-and-optimise';
export {
  RosterSearch,
  searchRoster,
  type RosterSearchOptions,
  type RosterSearchResult,
} from './lib/search/roster-search';
export {
  staffingSafety,
  staffingShortfall,
  staffingStatement,
  shortfallOnlyProblem,
} from './lib/safety/staffing';
export * from './lib/solve';
export * from './lib/pool';
export * from './lib/explain';
export * from './lib/demand';
