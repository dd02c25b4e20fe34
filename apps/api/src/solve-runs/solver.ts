/** The roster model's worker pool, as the API uses it. */
import { SolverError, SolverPool } from '@rotaplex/roster-model';

export { SolverError, SolverPool };

/** What a pool solve returns. */
export type PoolSolveResult = Awaited<ReturnType<SolverPool['solveRoster']>>;
