/**
 * When the hard rules cannot all hold: find a smallest conflicting set of rules and say it in words.
 *
 * 1. HiGHS's IIS analysis (`getIis`, strategy "row priority, irreducible") on the model's linear
 *    relaxation. Its rows map back through the row meta of buildModel to rule, person and day.
 * 2. When the relaxation is feasible (the conflict only appears with whole shifts), a deletion
 *    filter over rule groups (one group = one rule for one person): drop a group; if the MIP is
 *    still infeasible the group is not needed, otherwise put it back. What stays is a set of
 *    rules that conflict and where each one is needed (irreducible at group level).
 */
import type { Model, ModelData } from 'highs';
import type { RosterProblem } from '../problem';
import type { ConflictExplanation, HardRuleName } from '../result';
import type { BuiltModel } from '../model/build-model';
import type { RowMeta } from '../model/builder';
import type { HighsSession } from '../solve/highs-session';
import { MODEL_STATUS, solverArrays } from '../solve/run-mip';
import { dayLabel, hours, personName, shiftName } from './words';

/** highs.constants.iis.strategyRowPriority: rows first, refined to an irreducible set. */
const IIS_ROW_PRIORITY = 6;

const HARD_RULES = new Set<string>([
  'oneShiftPerDay',
  'absence',
  'pin',
  'minRest',
  'forbiddenSuccession',
  'maxShiftsPerType',
  'minPaidMinutes',
  'maxPaidMinutes',
  'maxConsecutiveWorkDays',
  'minConsecutiveWorkDays',
  'minConsecutiveDaysOff',
  'maxWeekends',
  'maxConsecutiveNights',
] satisfies HardRuleName[]);

const ABSENCE_WORDS = {
  leave: 'on leave',
  unavailable: 'unavailable',
  fixedDayOff: 'on a fixed day off',
} as const;

export interface ConflictOptions {
  /** Stop the deletion filter early (e.g. the user cancelled). */
  cancelled?: () => boolean;
  /** Time budget for the deletion filter, seconds (default 20). */
  timeLimitSeconds?: number;
}

/** One rule row in plain words. */
export function describeRow(problem: RosterProblem, meta: RowMeta): string | null {
  if (!HARD_RULES.has(meta.rule)) return null;
  const name = personName(problem, meta.personId);
  const person = problem.people.find((p) => p.id === meta.personId);
  const c = person?.contract ?? {};
  const day = meta.day === undefined ? '' : dayLabel(problem, meta.day);
  const span =
    meta.day === undefined
      ? ''
      : meta.lastDay !== undefined && meta.lastDay !== meta.day
        ? ` (${day} to ${dayLabel(problem, meta.lastDay)})`
        : ` (${day})`;
  switch (meta.rule as HardRuleName) {
    case 'pin':
      return `${name} is pinned to the ${shiftName(problem, meta.shiftTypeId)} shift on ${day}`;
    case 'absence': {
      const a = problem.absences.find(
        (x) =>
          x.personId === meta.personId &&
          x.day === meta.day &&
          (!x.shiftTypeIds || meta.shiftTypeId === undefined || x.shiftTypeIds.includes(meta.shiftTypeId)),
      );
      return `${name} is ${a ? ABSENCE_WORDS[a.kind] : 'absent'} on ${day}`;
    }
    case 'oneShiftPerDay':
      return `${name} works at most one shift a day${span}`;
    case 'minRest':
      return `${name} needs at least ${hours(c.minRestMinutes ?? 0)} rest between shifts${span}`;
    case 'forbiddenSuccession':
      return `${name} may not follow the ${shiftName(problem, meta.shiftTypeId)} shift with a forbidden one${span}`;
    case 'maxShiftsPerType': {
      const limit = meta.shiftTypeId === undefined ? undefined : c.maxShiftsPerType?.[meta.shiftTypeId];
      return `${name} may work at most ${limit ?? 'a limited number of'} ${shiftName(problem, meta.shiftTypeId)} shifts`;
    }
    case 'minPaidMinutes':
      return `${name} must work at least ${hours(c.minPaidMinutes ?? 0)} in the period`;
    case 'maxPaidMinutes':
      return `${name} may work at most ${hours(c.maxPaidMinutes ?? 0)} in the period`;
    case 'maxConsecutiveWorkDays':
      return `${name} may work at most ${c.maxConsecutiveWorkDays} days in a row${span}`;
    case 'minConsecutiveWorkDays':
      return `${name} must work at least ${c.minConsecutiveWorkDays} days in a row once they start${span}`;
    case 'minConsecutiveDaysOff':
      return `${name} needs at least ${c.minConsecutiveDaysOff} days off in a row${span}`;
    case 'maxWeekends':
      return `${name} may work at most ${c.maxWeekends} weekends`;
    case 'maxConsecutiveNights':
      return `${name} may work at most ${c.maxConsecutiveNights} nights in a row${span}`;
    default:
      return `${meta.rule} for ${name}${span}`;
  }
}

function iisRows(session: HighsSession, data: ModelData): number[] {
  try {
    return session.withModel(data, (model) => {
      model.options.set({ output_flag: false, iis_strategy: IIS_ROW_PRIORITY });
      return Array.from(model.getIis().rowIndex);
    });
  } catch {
    return [];
  }
}

/** Deletion filter over (rule, person) groups with MIP feasibility solves. Returns the rows of the kept groups. */
export function deletionFilter(session: HighsSession, built: BuiltModel, options: ConflictOptions): number[] {
  const groups = new Map<string, number[]>();
  built.rows.forEach((meta, row) => {
    if (!HARD_RULES.has(meta.rule)) return;
    const key = `${meta.rule}|${meta.personId ?? ''}`;
    const list = groups.get(key) ?? [];
    list.push(row);
    groups.set(key, list);
  });
  const deadline = performance.now() + (options.timeLimitSeconds ?? 20) * 1000;
  const { arrays } = built;
  const feasibility: ModelData = {
    ...solverArrays(built),
    colCost: new Float64Array(arrays.numCols),
    offset: 0,
  };
  return session.withModel(feasibility, (model: Model) => {
    model.options.set({ output_flag: false });
    const kept: number[][] = [];
    for (const rows of groups.values()) {
      const remaining = (deadline - performance.now()) / 1000;
      if (remaining <= 0.05 || options.cancelled?.()) {
        kept.push(rows); // out of time: keep the rest unexamined (the set is still conflicting)
        continue;
      }
      const indices = Int32Array.from(rows);
      model.changeRowsBounds(
        { kind: 'set', indices },
        new Float64Array(rows.length).fill(-Infinity),
        new Float64Array(rows.length).fill(Infinity),
      );
      model.options.set('time_limit', Math.min(remaining, 5));
      const status = model.run().modelStatus;
      if (status !== MODEL_STATUS.infeasible) {
        // Needed (or undecided): put the group back.
        model.changeRowsBounds(
          { kind: 'set', indices },
          Float64Array.from(rows, (r) => arrays.rowLower[r]),
          Float64Array.from(rows, (r) => arrays.rowUpper[r]),
        );
        kept.push(rows);
      }
    }
    return kept.flat();
  });
}

export function explainConflicts(
  session: HighsSession,
  built: BuiltModel,
  options: ConflictOptions = {},
): ConflictExplanation {
  const problem = built.problem;
  let rows = iisRows(session, solverArrays(built));
  let method = 'IIS';
  if (!rows.some((r) => HARD_RULES.has(built.rows[r]?.rule))) {
    rows = deletionFilter(session, built, options);
    method = 'deletion filter';
  }
  const sentences: string[] = [];
  const people = new Set<string>();
  for (const r of rows) {
    const meta = built.rows[r];
    if (!meta) continue;
    const text = describeRow(problem, meta);
    if (text && !sentences.includes(text)) sentences.push(text);
    if (text && meta.personId) people.add(meta.personId);
  }
  if (sentences.length === 0) {
    return {
      rules: [],
      summary:
        'The hard rules cannot all hold at once, but the conflicting rules could not be narrowed down.',
    };
  }
  // Absences remove shifts from the model entirely, so mention them for the people involved.
  const context: string[] = [];
  for (const id of people) {
    const days = new Set(
      problem.absences.filter((a) => a.personId === id && !a.shiftTypeIds).map((a) => a.day),
    );
    if (days.size > 0) {
      context.push(`${personName(problem, id)} is away on ${days.size} of the ${problem.days} days`);
    }
  }
  const summary =
    `These rules cannot all hold at the same time: ${sentences.join('; ')}.` +
    (context.length ? ` Note: ${context.join('; ')}.` : '') +
    (method === 'deletion filter' ? ' (Found by relaxing one rule at a time.)' : '');
  return { rules: sentences, summary };
}
