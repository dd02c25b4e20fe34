import { type SwapCellChangeDto, type SwapPreviewDto } from '@rotaplex/contracts';
import {
  type CheckResult,
  checkRoster,
  type Grid,
  ProblemIndex,
  type Roster,
  RULES,
  type Violation,
} from '@rotaplex/roster-model';
import { type AssignmentEntity } from '../roster-periods/assignment.entity';
import { checkDto, rosterOf } from '../assignments/assignments.service';
import { type RosterInput } from '../roster-input/roster-input.service';
import { type StoredCellChange } from './swap-request.entity';

type Cell = Pick<AssignmentEntity, 'staffMemberId' | 'date' | 'shiftTypeId'>;

/** The roster with the changes applied (a copy; the input roster is not touched). */
export function applyChanges(input: RosterInput, roster: Roster, changes: StoredCellChange[]): Roster {
  const next: Roster = Object.fromEntries(Object.entries(roster).map(([k, v]) => [k, [...v]]));
  for (const c of changes) {
    const day = input.dates.indexOf(c.date);
    if (day < 0 || !next[c.staffMemberId])
      throw new Error(`cell ${c.staffMemberId} ${c.date} is not in the roster`);
    next[c.staffMemberId][day] = c.after;
  }
  return next;
}

const key = (v: { rule: string; personId: string; days: number[] }) =>
  `${v.rule}|${v.personId}|${v.days.join(',')}`;

/**
 * The checker's findings for the people a change touches: every hard-rule violation of theirs in
 * the roster after the change, each marked new unless the roster before had the same violation
 * (rule, person, days) at least as large. A change with a new violation is blocked; violations the
 * published roster already had, and did not get worse, do not block it.
 */
export function evaluateChanges(
  input: RosterInput,
  rows: Cell[],
  changes: StoredCellChange[],
  cache: { before?: CheckResult } = {},
): SwapPreviewDto {
  const before = rosterOf(input, rows);
  const after = applyChanges(input, before, changes);
  const people = new Set(changes.map((c) => c.staffMemberId));
  // Callers testing many changes on one roster (the open-shift list) pass a cache for the roster before.
  const rawBefore = (cache.before ??= checkRoster(input.problem, before));
  const rawAfter = checkRoster(input.problem, after);
  const had = new Map<string, number>();
  for (const v of rawBefore.violations) {
    if (people.has(v.personId)) had.set(key(v), Math.max(had.get(key(v)) ?? 0, v.amount ?? 1));
  }
  const mine = rawAfter.violations.flatMap((v, i) => (people.has(v.personId) ? [{ v, i }] : []));
  // The same violations in the same order, in the period's words (dates, shift codes): only when needed.
  const words = mine.length ? checkDto(input, after).violations : [];
  const violations: SwapPreviewDto['violations'] = mine.map(({ v, i }) => {
    const was = had.get(key(v));
    return { ...words[i], isNew: was === undefined || (v.amount ?? 1) > was };
  });
  return {
    changes: changes.map((c) => changeDto(input, c)),
    violations,
    blocked: violations.some((v) => v.isNew),
    coverUnderMinBefore: rawBefore.terms.coverUnderMin,
    coverUnderMinAfter: rawAfter.terms.coverUnderMin,
  };
}

export function changeDto(
  input: Pick<RosterInput, 'staff' | 'shiftTypes'>,
  c: StoredCellChange,
  names?: Map<string, string>,
): SwapCellChangeDto {
  const code = (id: string | null) =>
    id === null ? null : (input.shiftTypes.find((s) => s.id === id)?.code ?? null);
  return {
    staffMemberId: c.staffMemberId,
    staffName: names?.get(c.staffMemberId) ?? input.staff.find((s) => s.id === c.staffMemberId)?.name ?? '',
    date: c.date,
    beforeShiftTypeId: c.before,
    beforeShiftCode: code(c.before),
    afterShiftTypeId: c.after,
    afterShiftCode: code(c.after),
  };
}

/** Cells whose current shift differs from the one recorded at proposal (empty: the lock holds). */
export function staleCells(rows: Cell[], changes: StoredCellChange[]): StoredCellChange[] {
  const current = new Map(rows.map((r) => [`${r.staffMemberId}|${r.date}`, r.shiftTypeId]));
  return changes.filter((c) => (current.get(`${c.staffMemberId}|${c.date}`) ?? null) !== c.before);
}

/**
 * `evaluateChanges(...).blocked` for one person taking one more shift, asked of that person's row
 * alone: every hard rule is about one person at a time, so no one else's violations can change.
 * Built once per roster (one ProblemIndex, one grid) and asked many times, as the open-shift list
 * does for every open need and person.
 */
export class ClaimCheck {
  private readonly index: ProblemIndex;
  private readonly grid: Grid;
  private readonly before = new Map<number, Map<string, number>>();

  constructor(
    private readonly input: RosterInput,
    rows: Cell[],
  ) {
    this.index = new ProblemIndex(input.problem);
    this.grid = this.index.toGrid(rosterOf(input, rows)).grid;
  }

  /** Whether the person working `shiftTypeId` on `date` (instead of their current cell) breaks a rule anew. */
  blocked(staffMemberId: string, date: string, shiftTypeId: string): boolean {
    const p = this.index.personIndex.get(staffMemberId);
    const d = this.input.dates.indexOf(date);
    const s = this.index.shiftIndex.get(shiftTypeId);
    if (p === undefined || d < 0 || s === undefined) return true;
    let had = this.before.get(p);
    if (!had) {
      had = new Map<string, number>();
      for (const v of this.violations(p, this.grid[p]))
        had.set(key(v), Math.max(had.get(key(v)) ?? 0, v.amount ?? 1));
      this.before.set(p, had);
    }
    const row = [...this.grid[p]];
    row[d] = s;
    return this.violations(p, row).some((v) => {
      const was = had.get(key(v));
      return was === undefined || (v.amount ?? 1) > was;
    });
  }

  private violations(p: number, row: readonly number[]): Violation[] {
    return RULES.flatMap((rule) => rule.checkPerson(this.index, p, row));
  }
}
