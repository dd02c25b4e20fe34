/**
 * How a solve in 'auto' shares its time limit between its phases (the local search, the MIP, the
 * column-generation bound and its rosters, fix-and-optimise, the staffing proof), and what each
 * share was measured against (docs/benchmarks.md). solve.ts and phases.ts read them.
 */
/**
 * From this many x columns on, 'auto' switches to 'mipThenFixAndOptimise'. On the shift scheduling
 * benchmark (SOURCES.md) instances 1-7 have 104-1,248 x columns and 8-12 have 2,158-10,452; on 10-12
 * the full MIP spends the whole minute in its root (cuts) and finds no roster beyond its first.
 */
export const AUTO_LARGE_MODEL_X = 2000;
/**
 * Time limit of each fix-and-optimise sub-MIP (seconds). Paired 60 s two-core runs of benchmark
 * instances 8, 10, 11 and 12 (docs/benchmarks.md): 1 s gave the better roster in 4 of 5 pairs
 * against 3 s (more, smaller neighbourhoods in the same time).
 */
export const FIX_AND_OPTIMISE_SUB_SECONDS = 1;
/** Share of the time for fix-and-optimise in 'auto' on large models. */
export const AUTO_FIX_AND_OPTIMISE_SHARE = 0.8;
/**
 * HiGHS options 'auto' sets for large models: the root LP by interior point (instance 10: first
 * bound after 11-13 s instead of 30 s; instance 12: after 27-28 s instead of none in 60 s) and more
 * heuristic effort at the root (default 0.05).
 */
export const AUTO_LARGE_HIGHS_OPTIONS: Record<string, string | number> = {
  mip_lp_solver: 'ipm',
  mip_heuristic_effort: 0.3,
};

/**
 * Share of the time for the local search before HiGHS. On the demo ward (17 people, 28 days) the
 * search finds in 5-10 s a roster that 30 s of the MIP alone did not; HiGHS then proves the bound
 * from it and improves it (docs/benchmarks.md).
 */
export const AUTO_SEARCH_SHARE = 0.4;
/**
 * Models with this many assignment columns or more (benchmark instances 13, 20 and 21 and beyond:
 * half-year periods, a hundred people) give the local search AUTO_SEARCH_SHARE_HUGE of the time and
 * do not wait for the MIP's root bound: on instance 20 (150 s) the MIP spent 48 s without a bound or
 * a better roster while the search and fix-and-optimise were still improving.
 */
export const AUTO_HUGE_MODEL_X = 40_000;
export const AUTO_SEARCH_SHARE_HUGE = 0.7;
/**
 * Large models below AUTO_HUGE_MODEL_X, where the column-generation bound and the rosters from its
 * lines come first after the search (LINE_BOUND_SHARE_LARGE, COLUMN_ROSTER_SHARE): side by side on
 * benchmark instances 8, 9, 10 and 12 (60 s, one core each), 0.15 against 0.4 gave 1312 / 1404,
 * 439 / 443, 4631 (optimal, in 31 s) / 4691 and 4500 / 4570 (docs/benchmarks.md).
 */
export const AUTO_SEARCH_SHARE_LARGE = 0.15;
/**
 * Latest end of the wait for the root bound in 'auto' (share of the time after the search): large
 * models run the MIP on past its share until then; small ones stop it at its share (HiGHS's own time
 * limit: its root sub-MIPs do not call back, and on the demo ward ran 7-8 s past the share) and, if
 * its root LP was not done, solve the LP relaxation alone until then. On large models
 * fix-and-optimise keeps at least 40% (it finds most of their improvements).
 */
export const MIP_BOUND_CAP = 0.9;
export const MIP_BOUND_CAP_LARGE = 0.6;

/**
 * The search hands over to HiGHS early when it has found nothing better for this long and for half
 * its time so far: small problems then reach HiGHS (which proves them optimal) within a second or two.
 */
export const SEARCH_STALL_MS = 1000;
/**
 * Models from this many x columns up to AUTO_LARGE_MODEL_X search their whole share without the
 * stall rule: there the search's later, longer cooling rounds keep finding better rosters after quiet
 * spells of several seconds. The demo ward (1,673 columns), 30 s, one core, twelve pairs: better in
 * eight (means 2,400.2 against 2,410.5); benchmark instance 7 (1,248 columns), 60 s, two pairs:
 * 1,059 / 1,155 and 1,092 / 1,061; 6 (1,040): equal in both; on two cores the demo ward stayed the
 * same (four pairs). Smaller models keep
 * the rule (instances 1-5, 104-676 columns: HiGHS proves them within seconds of the hand-over), and
 * so do large ones (not measured).
 */
export const SEARCH_NO_STALL_X = 1000;

/**
 * The search hands over after this share of its time when it has found no roster that keeps every
 * hard rule (benchmark Instances 20 and 21, 50 and 100 people over 182 days: none in 240 s under
 * load); fix-and-optimise then repairs the roster on the elastic model.
 */
export const SEARCH_GIVE_UP_SHARE = 0.25;

/**
 * In 'auto', a MIP bound further than this share below the best roster gets the column-generation
 * bound for at most LINE_BOUND_SHARE of the time left; it stops as soon as it proves the roster
 * optimal. On benchmark instances 1-12 it reaches the published column-generation LP bounds (within
 * 0.3% of the optimum on 5-12, equal to it on 2-4, 10-12) where the MIP's bound after 60 s is up to
 * 18% lower; on the demo ward the MIP's bound is better (docs/benchmarks.md).
 */
export const LINE_BOUND_GAP = 0.02;
export const LINE_BOUND_SHARE = 0.25;
/**
 * The column-generation bound gives up (and gives its time back, with no rosters from its lines)
 * once its master's value falls more than this share below the best roster (under 40% of it): the
 * bound can only be lower still. On benchmark instances 1-12 the bound is within 1% of the optimum
 * and the search's rosters well under twice it; on the generated ward (bench/ward.ts) the master
 * falls to 38 against rosters of 63-278, and at 300-600 s the phase used to keep 250-400 s without
 * a bound or a roster (docs/benchmarks.md).
 */
export const LINE_BOUND_HOPELESS_GAP = 0.6;
/**
 * On large models (AUTO_LARGE_MODEL_X) the column-generation bound comes first, for at most this
 * share of the time after the search (the time the MIP would wait for its root bound); solved to
 * the end, it replaces the MIP, which on these models spends its time in the root (instances
 * 10-12), and fix-and-optimise gets the rest.
 */
export const LINE_BOUND_SHARE_LARGE = 0.4;
/**
 * Once the column-generation bound has been computed, rosters from its lines (the dive, then the
 * best roster made of the master's lines) get at most this share of the time left, the dive's
 * pricing at most COLUMN_DIVE_SHARE of that (a dive that will not finish gives up early).
 * Alone, after the bound, they reach the best known rosters of instances 5 and 11, and 439 on 9,
 * 1,059 on 7 and 1,317 on 8 in 2-24 s, where the local search and fix-and-optimise stayed 2-15%
 * above in a minute (docs/benchmarks.md).
 */
export const COLUMN_ROSTER_SHARE = 0.7;
export const COLUMN_DIVE_SHARE = 0.75;

/** Share of the time limit, and most seconds, kept for proving the fewest people short of minimum. */
export const STAFFING_SHARE = 0.1;
export const STAFFING_MAX_SECONDS = 10;
/** Seconds the staffing proof gets at least (when the time limit leaves them). */
export const STAFFING_MIN_SECONDS = 1;

/** Progress events at most this often (HiGHS's own events keep the same interval). */
export const PROGRESS_INTERVAL_MS = 250;

/** Share of the time after the search for fix-and-optimise on models below AUTO_LARGE_MODEL_X. */
export const AUTO_FIX_AND_OPTIMISE_SHARE_SMALL = 0.6;
/**
 * Small models in 'auto': after the MIP, fix-and-optimise gets this share of the time left before
 * the column-generation bound is considered (LINE_BOUND_GAP), and the rest after it. The gap that
 * decides is then a polished roster's: on the demo ward (30 s, one core, six seeds) the bound, which
 * does not finish there, no longer takes a quarter of the time (mean 2,399 against 2,409.3); on
 * benchmark instances 1-7 (60 s) every result stayed the same or better (docs/benchmarks.md).
 */
export const FIX_AND_OPTIMISE_BEFORE_COLUMNS = 0.6;
