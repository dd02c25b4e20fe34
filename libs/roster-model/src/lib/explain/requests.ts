/**
 * Why a request was not honoured: which rule or goal won. Each unhonoured request is tried on its
 * own (the cell changed the way the person asked, everything else kept) and the checker's rule and
 * goal modules say what that would break or make worse.
 */
import type { Roster, RosterProblem, ShiftRequest } from '../problem';
import type { RequestExplanation } from '../result';
import { NO_PIN, PIN_OFF, ProblemIndex } from '../model/context';
import { requestHonoured } from '../goals/requests';
import { WhatIf, type TermChange } from './what-if';
import { GOAL_WORDS, dayLabel, shiftName } from './words';

const ABSENCE_WORDS = {
  leave: 'on leave',
  unavailable: 'unavailable',
  fixedDayOff: 'on a fixed day off',
} as const;

function describeRequest(problem: RosterProblem, r: ShiftRequest): string {
  const when = dayLabel(problem, r.day);
  if (r.kind === 'dayOff') return `a day off on ${when}`;
  const shift = shiftName(problem, r.shiftTypeId);
  return r.kind === 'shiftOn' ? `the ${shift} shift on ${when}` : `no ${shift} shift on ${when}`;
}

/** Reasons from the objective terms a change would make worse. */
function costReasons(changes: TermChange[], currentShift: string | null): string[] {
  const net = changes.reduce((sum, c) => sum + c.delta, 0);
  if (net < -1e-9)
    return ['Honouring it would make the roster better; the solve stopped before finding that roster.'];
  const worse = changes.filter((c) => c.delta > 1e-9 && c.term !== 'requests');
  const reasons: string[] = [];
  const coverShort = worse.some((c) => c.term === 'coverUnderMin' || c.term === 'coverUnderTarget');
  if (coverShort && currentShift)
    reasons.push(`They were needed for cover on the ${currentShift} shift that day.`);
  else if (coverShort) reasons.push('Changing it would leave another shift short of cover.');
  const others = worse.filter((c) => c.term !== 'coverUnderMin' && c.term !== 'coverUnderTarget');
  if (others.length)
    reasons.push(`Honouring it would cost more in ${others.map((c) => GOAL_WORDS[c.term]).join(', ')}.`);
  if (changes.some((c) => c.term === 'requests' && c.delta > 1e-9)) {
    reasons.push('It conflicts with other requests that weigh as much or more.');
  }
  if (reasons.length === 0)
    reasons.push('Honouring it would give an equally good roster; the solver chose another.');
  return reasons;
}

export function explainRequests(
  problem: RosterProblem,
  roster: Roster,
  index: ProblemIndex = new ProblemIndex(problem),
): RequestExplanation[] {
  const { grid } = index.toGrid(roster);
  const whatIf = new WhatIf(index, grid);
  const out: RequestExplanation[] = [];
  for (const r of problem.requests) {
    if (requestHonoured(index, r, grid)) continue;
    const p = index.personIndex.get(r.personId) as number;
    const d = r.day;
    const reasons: string[] = [];
    const current = grid[p][d];
    const currentShift = current >= 0 ? shiftName(problem, index.shiftId(current)) : null;
    const pin = index.pinOf(p, d);
    const name = index.personName(p);
    reasons.push(`${name} asked for ${describeRequest(problem, r)}.`);

    if (r.kind === 'shiftOn') {
      const s = index.shiftIndex.get(r.shiftTypeId as string) as number;
      const absence = problem.absences.find(
        (a) =>
          a.personId === r.personId &&
          a.day === d &&
          (!a.shiftTypeIds || a.shiftTypeIds.includes(r.shiftTypeId as string)),
      );
      if (absence) reasons.push(`They are ${ABSENCE_WORDS[absence.kind]} that day.`);
      else if (pin !== NO_PIN) {
        reasons.push(
          `The day is pinned to ${pin === PIN_OFF ? 'a day off' : `the ${shiftName(problem, index.shiftId(pin))} shift`}.`,
        );
      } else if (index.maxShifts(p, s) === 0) {
        reasons.push(`Their contract does not allow ${shiftName(problem, r.shiftTypeId)} shifts.`);
      } else {
        const broken = whatIf.newViolations(p, d, s);
        if (broken.length) reasons.push(`Giving them that shift would break a rule: ${broken[0].message}.`);
        else reasons.push(...costReasons(whatIf.termChanges(p, d, s), currentShift));
      }
    } else {
      // shiftOff or dayOff: they got a shift they did not want. Try a day off, and for shiftOff any other shift.
      if (pin !== NO_PIN) {
        reasons.push(`The day is pinned to the ${currentShift ?? 'assigned'} shift.`);
      } else {
        const alternatives = [-1];
        if (r.kind === 'shiftOff') {
          for (let s = 0; s < index.S; s++) if (s !== current && index.isFree(p, d, s)) alternatives.push(s);
        }
        const tried = alternatives.map((s) => ({ s, broken: whatIf.newViolations(p, d, s) }));
        const possible = tried.filter((t) => t.broken.length === 0);
        if (possible.length === 0) {
          reasons.push(`Taking them off that shift would break a rule: ${tried[0].broken[0].message}.`);
        } else {
          const costs = possible.map((t) => ({ s: t.s, changes: whatIf.termChanges(p, d, t.s) }));
          costs.sort(
            (a, b) => a.changes.reduce((x, c) => x + c.delta, 0) - b.changes.reduce((x, c) => x + c.delta, 0),
          );
          reasons.push(...costReasons(costs[0].changes, currentShift));
        }
      }
    }
    out.push({ personId: r.personId, day: d, kind: r.kind, reasons });
  }
  return out;
}
