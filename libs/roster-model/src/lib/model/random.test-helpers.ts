/** Seeded random small roster problems for tests (invented data), using every rule and goal. */
import type { RosterProblem } from '../problem';
import { mulberry32 } from '../random';
import { EARLY, LATE, NIGHT, person, problem } from './fixtures.test-helpers';

/** Seeded generator for tests (mulberry32). */
export const seeded = mulberry32;

export function randomProblem(seed: number, people = 5, days = 7): RosterProblem {
  const r = seeded(seed);
  const int = (lo: number, hi: number) => lo + Math.floor(r() * (hi - lo + 1));
  const ids = [...Array(people).keys()].map((i) => `p${i}`);
  const shiftIds = ['E', 'L', 'N'];
  return problem({
    days,
    startDate: '2026-03-05', // a Thursday, so the period holds a whole and a cut weekend
    people: ids.map((id, i) =>
      person(
        id,
        {
          maxConsecutiveWorkDays: int(3, 5),
          minConsecutiveWorkDays: r() < 0.5 ? 2 : undefined,
          minConsecutiveDaysOff: r() < 0.5 ? 2 : undefined,
          maxWeekends: r() < 0.5 ? 1 : undefined,
          maxConsecutiveNights: 2,
          maxShiftsPerType: r() < 0.3 ? { N: 0 } : { N: 3 },
          maxPaidMinutes: int(4, 6) * 480,
          minPaidMinutes: r() < 0.3 ? 480 : undefined,
          targetPaidMinutes: r() < 0.5 ? 4 * 480 : undefined,
          minRestMinutes: 660,
        },
        { skills: i % 2 === 0 ? ['rn'] : [], hourlyCost: int(10, 20) },
      ),
    ),
    coverNeeds: [...Array(days).keys()].flatMap((day) =>
      shiftIds.map((shiftTypeId) => {
        const target = int(0, 2);
        return {
          day,
          shiftTypeId,
          skillId: shiftTypeId === 'N' ? 'rn' : null,
          min: Math.min(target, int(0, 1)),
          target,
        };
      }),
    ),
    requests: [...Array(int(3, 8))]
      .map(() => {
        const kind = (['shiftOn', 'shiftOff', 'dayOff'] as const)[int(0, 2)];
        return {
          personId: ids[int(0, people - 1)],
          day: int(0, days - 1),
          kind,
          shiftTypeId: shiftIds[int(0, 2)],
          weight: int(1, 3),
        };
      })
      .filter((q, i, all) => all.findIndex((o) => o.personId === q.personId && o.day === q.day) === i),
    absences: [...Array(int(1, 4))].map(() => ({
      personId: ids[int(0, people - 1)],
      day: int(0, days - 1),
      kind: 'leave' as const,
    })),
    forbiddenSuccessions: [{ from: 'N', to: 'E' }],
    pins: [{ personId: ids[0], day: 0, shiftTypeId: 'L' }],
    shiftTypes: [EARLY, LATE, NIGHT],
    weights: { labourCost: 0.01 },
  });
}
