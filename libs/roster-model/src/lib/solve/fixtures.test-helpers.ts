/**
 * Small roster problems for the solve, pool and explanation tests. Each is tiny so a test solves
 * it in seconds; expected outcomes are worked out by hand beside the tests that use them.
 *
 * Shift times follow common practice for three-shift hospital rosters (early 07:00-15:00, late
 * 14:30-22:30, night 22:00-07:30). The 11-hour minimum rest is the daily rest of the EU Working
 * Time Directive 2003/88/EC, Art. 3; a 5-day limit on consecutive working days is common practice.
 */
import type { Contract, Person, RosterProblem, ShiftType } from '../problem';

export const SHIFTS: ShiftType[] = [
  { id: 'E', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 450 },
  { id: 'L', name: 'Late', start: '14:30', end: '22:30', paidMinutes: 450 },
  { id: 'N', name: 'Night', start: '22:00', end: '07:30', paidMinutes: 540 },
];

export const WARD_CONTRACT: Contract = {
  minRestMinutes: 11 * 60,
  maxConsecutiveWorkDays: 5,
  maxPaidMinutes: 5 * 540,
};

export function person(
  id: string,
  name: string,
  skills: string[],
  contract: Contract = WARD_CONTRACT,
): Person {
  return { id, name, skills, contract };
}

/** A week for a small team: every day needs 1 registered nurse (skill rn) on each shift, 2 people on earlies. */
export function smallWard(overrides: Partial<RosterProblem> = {}): RosterProblem {
  const people = [
    person('ada', 'Ada Byrne', ['rn']),
    person('ben', 'Ben Okafor', ['rn']),
    person('cy', 'Cy Lindqvist', ['rn']),
    person('dee', 'Dee Marsh', ['ca']),
    person('eli', 'Eli Novak', ['ca']),
    person('fay', 'Fay Quist', ['rn', 'ca']),
  ];
  const coverNeeds: RosterProblem['coverNeeds'] = [];
  for (let day = 0; day < 7; day++) {
    for (const s of SHIFTS) coverNeeds.push({ day, shiftTypeId: s.id, skillId: 'rn', min: 1, target: 1 });
    coverNeeds.push({ day, shiftTypeId: 'E', skillId: null, min: 2, target: 2 });
  }
  return {
    startDate: '2026-03-02',
    days: 7,
    timeZone: 'Europe/London',
    shiftTypes: SHIFTS,
    people,
    coverNeeds,
    requests: [],
    absences: [],
    forbiddenSuccessions: [],
    pins: [],
    // Fair-spread goals make even tiny problems slow to prove; these tests are about other things.
    weights: { fairNights: 0, fairWeekends: 0 },
    ...overrides,
  };
}

/**
 * A harder problem for progress, cancel and time-limit tests: `size` people over four weeks with
 * targets above the minimum, shift-on/off requests and fair spread of nights and weekends, so
 * HiGHS needs well over a few seconds to prove the optimum. A seeded generator makes it the same
 * every run.
 */
export function busyUnit(size = 24, seed = 7): RosterProblem {
  let state = seed;
  const rnd = (): number => {
    state = (state * 1103515245 + 12345) % 2147483648;
    return state / 2147483648;
  };
  const people: Person[] = [];
  for (let i = 0; i < size; i++) {
    people.push(
      person(`p${i}`, `Person ${i}`, i % 3 === 0 ? ['rn', 'ca'] : i % 3 === 1 ? ['rn'] : ['ca'], {
        ...WARD_CONTRACT,
        maxPaidMinutes: 20 * 540,
        minPaidMinutes: 12 * 450,
        targetPaidMinutes: 16 * 450,
        maxWeekends: 2,
      }),
    );
  }
  const days = 28;
  const coverNeeds: RosterProblem['coverNeeds'] = [];
  for (let day = 0; day < days; day++) {
    for (const s of SHIFTS) {
      const base = s.id === 'N' ? 2 : 4;
      coverNeeds.push({
        day,
        shiftTypeId: s.id,
        skillId: null,
        min: base - 1,
        target: base + (rnd() < 0.3 ? 1 : 0),
      });
      coverNeeds.push({ day, shiftTypeId: s.id, skillId: 'rn', min: 1, target: 2 });
    }
  }
  const requests: RosterProblem['requests'] = [];
  for (let k = 0; k < size * 4; k++) {
    const p = Math.floor(rnd() * size);
    const day = Math.floor(rnd() * days);
    const kind = rnd() < 0.5 ? 'dayOff' : rnd() < 0.5 ? 'shiftOn' : 'shiftOff';
    const shiftTypeId = SHIFTS[Math.floor(rnd() * 3)].id;
    requests.push({
      personId: `p${p}`,
      day,
      kind,
      shiftTypeId: kind === 'dayOff' ? undefined : shiftTypeId,
      weight: 1 + Math.floor(rnd() * 3),
    });
  }
  return {
    startDate: '2026-03-02',
    days,
    timeZone: 'Europe/London',
    shiftTypes: SHIFTS,
    people,
    coverNeeds,
    requests,
    absences: [],
    forbiddenSuccessions: [],
    pins: [],
  };
}
