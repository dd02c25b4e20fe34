/**
 * Why a cover need is short: for every person who could count towards it but is not on the
 * shift, find the first thing that stops them, by re-checking the roster with that person added
 * (the checker's own rule logic), and report the reasons as counts in plain words.
 *
 * Order of reasons per person: absence (leave, unavailable, fixed day off) → pinned elsewhere →
 * contract forbids the shift type → the first hard rule the change would break → otherwise the
 * objective terms that adding them would make worse (they were worth more elsewhere).
 */
import type { Roster, RosterProblem } from '../problem';
import type { HardRuleName, UnmetNeedExplanation } from '../result';
import { NO_PIN, ProblemIndex } from '../model/context';
import { WhatIf, type TermChange } from './what-if';
import { GOAL_WORDS, RULE_BLOCK_WORDS, dayLabel, nameList, plural, shiftName } from './words';

export interface ExplainLimits {
  /** Explain at most this many short needs (the rest get a one-line note). Default 200. */
  maxNeeds?: number;
  /** Recompute objective terms for at most this many candidates per need. Default 25. */
  maxCostChecksPerNeed?: number;
}

const ABSENCE_WORDS = {
  leave: ['is on leave', 'are on leave'],
  unavailable: ['is unavailable', 'are unavailable'],
  fixedDayOff: ['has a fixed day off', 'have a fixed day off'],
} as const;

function costWords(changes: TermChange[]): string {
  const worse = changes.filter((c) => c.delta > 0).map((c) => GOAL_WORDS[c.term]);
  return worse.length ? worse.join(', ') : '';
}

export function explainUnmetNeeds(
  problem: RosterProblem,
  roster: Roster,
  index: ProblemIndex = new ProblemIndex(problem),
  limits: ExplainLimits = {},
): UnmetNeedExplanation[] {
  const { grid } = index.toGrid(roster);
  const whatIf = new WhatIf(index, grid);
  const maxNeeds = limits.maxNeeds ?? 200;
  const maxCostChecks = limits.maxCostChecksPerNeed ?? 25;
  const out: UnmetNeedExplanation[] = [];

  for (const need of problem.coverNeeds) {
    const s = index.shiftIndex.get(need.shiftTypeId);
    if (s === undefined || need.day < 0 || need.day >= index.D) continue;
    const d = need.day;
    const eligible: number[] = [];
    for (let p = 0; p < index.P; p++)
      if (need.skillId === null || index.skills[p].has(need.skillId)) eligible.push(p);
    const onShift = eligible.filter((p) => grid[p][d] === s).length;
    const short = need.target - onShift;
    if (short <= 0) continue;
    const what = `${shiftName(problem, need.shiftTypeId)} on ${dayLabel(problem, d)}`;
    const reasons: string[] = [];
    if (onShift < need.min) reasons.push(`${what} has ${onShift}, below its minimum of ${need.min}.`);
    else reasons.push(`${what} has ${onShift} of the ${need.target} wanted.`);

    if (out.length >= maxNeeds) {
      reasons.push('Not analysed further: too many short needs in this roster to explain each one.');
      out.push({ day: d, shiftTypeId: need.shiftTypeId, skillId: need.skillId, short, reasons });
      continue;
    }

    const pool =
      need.skillId === null
        ? 'people'
        : `people with skill ${problem.skillNames?.[need.skillId] ?? need.skillId}`;
    if (eligible.length === 0) {
      reasons.push(
        need.skillId === null ? 'There is nobody in the team.' : `Nobody has skill ${need.skillId}.`,
      );
    } else if (eligible.length < need.target) {
      const n = eligible.length;
      reasons.push(
        need.skillId === null
          ? `Only ${n} ${plural(n, 'person is', 'people are')} in the team.`
          : `Only ${n} ${plural(n, 'person has', 'people have')} skill ${need.skillId}.`,
      );
    }

    // Group candidates (eligible, not on this shift) by their first reason.
    const groups = new Map<string, { verbOne: string; verbMany: string; names: string[] }>();
    const add = (key: string, verbOne: string, verbMany: string, p: number): void => {
      const g = groups.get(key) ?? { verbOne, verbMany, names: [] };
      g.names.push(index.personName(p));
      groups.set(key, g);
    };
    let costChecks = 0;
    for (const p of eligible) {
      if (grid[p][d] === s) continue;
      if (index.isAbsent(p, d, s)) {
        const personId = index.personId(p);
        const a = problem.absences.find(
          (x) =>
            x.personId === personId &&
            x.day === d &&
            (!x.shiftTypeIds || x.shiftTypeIds.includes(need.shiftTypeId)),
        );
        const [one, many] = ABSENCE_WORDS[a?.kind ?? 'unavailable'];
        add(`absent:${a?.kind ?? 'unavailable'}`, one, many, p);
        continue;
      }
      const pin = index.pinOf(p, d);
      if (pin !== NO_PIN) {
        add('pinned', 'is pinned to something else that day', 'are pinned to something else that day', p);
        continue;
      }
      if (index.maxShifts(p, s) === 0) {
        const type = shiftName(problem, need.shiftTypeId);
        add('contractType', `may not work ${type} shifts`, `may not work ${type} shifts`, p);
        continue;
      }
      const broken = whatIf.newViolations(p, d, s);
      if (broken.length > 0) {
        const rule: HardRuleName = broken[0].rule;
        const words = RULE_BLOCK_WORDS[rule];
        add(`rule:${rule}`, `would ${words}`, `would ${words}`, p);
        continue;
      }
      const elsewhere = grid[p][d] >= 0;
      const moveWords = elsewhere
        ? `works ${shiftName(problem, index.shiftId(grid[p][d]))} that day`
        : 'is off that day and could be added';
      const moveWordsMany = elsewhere ? 'work another shift that day' : 'are off that day and could be added';
      if (costChecks >= maxCostChecks) {
        add(
          `free:${elsewhere}`,
          `${moveWords} without breaking a rule`,
          `${moveWordsMany} without breaking a rule`,
          p,
        );
        continue;
      }
      costChecks += 1;
      const changes = whatIf.termChanges(p, d, s);
      const net = changes.reduce((sum, c) => sum + c.delta, 0);
      const worse = costWords(changes);
      if (net > 1e-9 && worse) {
        add(
          `cost:${elsewhere}:${worse}`,
          `${moveWords}, but that would cost more in ${worse}`,
          `${moveWordsMany}, but that would cost more in ${worse}`,
          p,
        );
      } else if (net < -1e-9) {
        add(
          `better:${elsewhere}`,
          `${moveWords} and that would make the roster better; the solve stopped before finding it`,
          `${moveWordsMany} and that would make the roster better; the solve stopped before finding it`,
          p,
        );
      } else {
        add(
          `tie:${elsewhere}`,
          `${moveWords} at no extra cost (an equally good roster)`,
          `${moveWordsMany} at no extra cost (an equally good roster)`,
          p,
        );
      }
    }
    const total = eligible.length;
    for (const g of [...groups.values()].sort((a, b) => b.names.length - a.names.length)) {
      const n = g.names.length;
      reasons.push(
        `${n} of the ${total} ${pool} ${n === 1 ? g.verbOne : g.verbMany} (${nameList(g.names)}).`,
      );
    }
    out.push({ day: d, shiftTypeId: need.shiftTypeId, skillId: need.skillId, short, reasons });
  }
  return out;
}
