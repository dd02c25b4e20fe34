/**
 * Benchmark of demand to cover: requirement (Erlang C + shrinkage per interval) and the covering
 * MIP for a 4-week period at 15-minute intervals (28 x 96 = 2,688 intervals).
 *
 *   npm run bench:demand -- [--runs N] [--days D] [--interval 15|30|60]
 *
 * The forecast is invented (a weekday curve with a morning and an afternoon peak, lighter
 * Saturdays, closed Sundays). Scenarios: the demo contact centre's two shift types; eight
 * staggered shift types; the eight with a cap on people per day that forces under-cover. The
 * HiGHS session is loaded and warmed before the first timed run (a server keeps it warm); each
 * scenario runs N times and the table prints every run's time and the median. One core.
 */
import type { ContactCentreDemandDto, ContactIntervalDto } from '@rotaplex/contracts';
import { contactRequirement, planContactCover, type PlanShiftType } from '../demand/plan';
import { threadSession } from '../solve/run-mip';

function argValue(name: string, fallback: number): number {
  const i = process.argv.indexOf(name);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
}

const runs = argValue('--runs', 5);
const days = argValue('--days', 28);
const interval = argValue('--interval', 15) as 15 | 30 | 60;

function pad(n: number): string {
  return String(n).padStart(2, '0');
}

/** Invented contacts per interval: open 08:00-22:00, peaks near 10:30 and 14:30. */
function dayCurve(scale: number): ContactIntervalDto[] {
  const out: ContactIntervalDto[] = [];
  for (let m = 8 * 60; m < 22 * 60; m += interval) {
    const h = m / 60;
    const shape = 0.25 + Math.exp(-((h - 10.5) ** 2) / 3) + 0.8 * Math.exp(-((h - 14.5) ** 2) / 4);
    out.push({
      start: `${pad(Math.floor(m / 60))}:${pad(m % 60)}`,
      contacts: Math.round(scale * shape * (interval / 15) * 10) / 10,
      ahtSeconds: 300 + Math.round(40 * Math.sin(h)),
    });
  }
  return out;
}

const demand: ContactCentreDemandDto = {
  intervalMinutes: interval,
  skillId: null,
  service: { targetPercent: 80, targetSeconds: 20, maxOccupancyPercent: 85, shrinkagePercent: 30 },
  pattern: [1, 2, 3, 4, 5].map((weekday) => ({ weekday, intervals: dayCurve(60) })),
  dates: [],
  shiftTypeIds: [],
  maxPeoplePerDay: null,
};
demand.pattern.push({ weekday: 6, intervals: dayCurve(25) });

const dates = Array.from({ length: days }, (_, d) => {
  const t = new Date(Date.UTC(2027, 0, 4 + d)); // a Monday
  return t.toISOString().slice(0, 10);
});

const DEMO_SHIFTS: PlanShiftType[] = [
  { id: 'D', start: '08:00', end: '16:30', paidMinutes: 480 },
  { id: 'EV', start: '13:30', end: '22:00', paidMinutes: 480 },
];
const STAGGERED: PlanShiftType[] = [
  '06:30',
  '07:00',
  '08:00',
  '09:00',
  '10:00',
  '11:30',
  '13:00',
  '14:00',
].map((start, i) => {
  const [h, m] = start.split(':').map(Number);
  return { id: `S${i}`, start, end: `${pad((h + 8) % 24)}:${pad(m)}`, paidMinutes: 450 };
});

interface Row {
  scenario: string;
  times: number[];
  reqMs: number;
  paidHours: number;
  short: number;
  status: string;
}

async function scenario(name: string, shifts: PlanShiftType[], cap: number | null): Promise<Row> {
  const times: number[] = [];
  let reqMs = 0;
  let last: Awaited<ReturnType<typeof planContactCover>> | null = null;
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    const requirement = contactRequirement(demand, dates);
    const t1 = performance.now();
    last = await planContactCover(requirement, dates, interval, shifts, { maxPeoplePerDay: cap });
    times.push(performance.now() - t0);
    reqMs = t1 - t0;
  }
  return {
    scenario: name,
    times,
    reqMs,
    paidHours: last?.paidHours ?? 0,
    short: last?.underCoverPersonIntervals ?? 0,
    status: last?.status ?? '',
  };
}

async function main() {
  await threadSession();
  const perDay = 1440 / interval;
  console.log(
    `demand to cover: ${days} days x ${perDay} intervals = ${days * perDay} intervals, ${runs} runs each`,
  );
  const rows = [
    await scenario('demo shift types (2)', DEMO_SHIFTS, null),
    await scenario('8 staggered shift types', STAGGERED, null),
    await scenario('8 staggered, cap 40 people/day', STAGGERED, 40),
  ];
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
  console.log('');
  console.log(
    '| scenario | runs (ms) | median (ms) | requirement, last run (ms) | paid hours | short person-intervals | status |',
  );
  console.log('| --- | --- | ---: | ---: | ---: | ---: | --- |');
  for (const r of rows) {
    console.log(
      `| ${r.scenario} | ${r.times.map((t) => t.toFixed(0)).join(', ')} | ${median(r.times).toFixed(0)} | ${r.reqMs.toFixed(0)} | ${r.paidHours.toFixed(1)} | ${r.short} | ${r.status} |`,
    );
  }
}

main().then(
  () => process.exit(0),
  (err: unknown) => {
    console.error(err);
    process.exit(1);
  },
);
