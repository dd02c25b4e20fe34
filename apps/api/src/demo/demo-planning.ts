import { type ContractRules } from '@rotaplex/contracts';
import { type EntityManager } from 'typeorm';
import { addDays, localDate } from '../common/dates';
import { ContractEntity } from '../contracts/contract.entity';
import { CoverOverrideEntity, CoverPatternRowEntity } from '../cover-needs/cover-need.entity';
import { LeaveRequestEntity } from '../requests/requests.entities';
import { RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { ShiftTypeEntity } from '../shift-types/shift-type.entity';
import { SkillEntity } from '../skills/skill.entity';
import { StaffMemberEntity } from '../staff/staff-member.entity';
import { type UnitEntity } from '../units/unit.entity';
import { type UserEntity } from '../users/user.entity';
import { DEMO_USERS, type DemoUnitKey } from './demo-data';
import { seedDemoStaffInput } from './demo-requests';

/**
 * Invented planning data for the demo organisation: skills, shift types, two contracts, a staff
 * member for every demo staff user, weekly cover patterns, one date override and a four-week draft
 * roster period per unit with staff input (demo-requests.ts). All numbers are invented for the demo.
 */
export const DEMO_SKILLS: readonly { code: string; name: string; registered?: boolean }[] = [
  // Registered: its shortfalls are checked for the safe-staffing red flags (NICE SG1 2014).
  { code: 'RN', name: 'Registered nurse', registered: true },
  { code: 'HCA', name: 'Healthcare assistant' },
  { code: 'EN', name: 'English' },
  { code: 'GA', name: 'Irish' },
  { code: 'FR', name: 'French' },
  { code: 'PL', name: 'Polish' },
  { code: 'ES', name: 'Spanish' },
  { code: 'DE', name: 'German' },
  { code: 'PT', name: 'Portuguese' },
  { code: 'IT', name: 'Italian' },
  { code: 'AR', name: 'Arabic' },
];

const LANGUAGE_SKILL: Record<string, string> = {
  English: 'EN',
  Irish: 'GA',
  French: 'FR',
  Polish: 'PL',
  Spanish: 'ES',
  German: 'DE',
  Portuguese: 'PT',
  Italian: 'IT',
  Arabic: 'AR',
};

export const DEMO_SHIFT_TYPES: Record<
  DemoUnitKey,
  Pick<ShiftTypeEntity, 'code' | 'name' | 'start' | 'end' | 'paidMinutes' | 'colour' | 'night'>[]
> = {
  ward: [
    { code: 'E', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 450, colour: 'teal', night: null },
    { code: 'L', name: 'Late', start: '14:30', end: '22:30', paidMinutes: 450, colour: 'amber', night: null },
    { code: 'N', name: 'Night', start: '22:00', end: '07:30', paidMinutes: 540, colour: 'plum', night: true },
  ],
  contact: [
    { code: 'D', name: 'Day', start: '08:00', end: '16:30', paidMinutes: 480, colour: 'sky', night: null },
    {
      code: 'EV',
      name: 'Evening',
      start: '13:30',
      end: '22:00',
      paidMinutes: 480,
      colour: 'coral',
      night: null,
    },
  ],
};

const NONE: ContractRules = {
  maxShiftsPerType: null,
  minPaidMinutes: null,
  maxPaidMinutes: null,
  targetPaidMinutes: null,
  maxConsecutiveWorkDays: null,
  minConsecutiveWorkDays: null,
  minConsecutiveDaysOff: null,
  maxWeekends: null,
  maxConsecutiveNights: null,
  minRestMinutes: null,
};

/** Organisation-wide contracts, per week (weekends per 4 weeks). */
export const DEMO_CONTRACTS: { name: string; rules: ContractRules }[] = [
  {
    name: 'Full-time 37.5 h',
    rules: {
      ...NONE,
      targetPaidMinutes: 2250,
      minPaidMinutes: 1800,
      maxPaidMinutes: 2880,
      maxConsecutiveWorkDays: 6,
      minConsecutiveDaysOff: 2,
      maxWeekends: 2,
      maxConsecutiveNights: 4,
      minRestMinutes: 660,
    },
  },
  {
    name: 'Part-time 22.5 h',
    rules: {
      ...NONE,
      targetPaidMinutes: 1350,
      minPaidMinutes: 900,
      maxPaidMinutes: 1800,
      maxConsecutiveWorkDays: 4,
      maxWeekends: 2,
      maxConsecutiveNights: 3,
      minRestMinutes: 660,
    },
  },
];

/** Demo people on the part-time contract. */
const PART_TIME = new Set([
  'Beth Lindqvist',
  'Lucy Fenwick',
  'Ana Ferreira',
  'Marco Bellini',
  'Joel Pemberton',
  'Rosa Quintrell',
  'Tariq Osei',
]);

/**
 * Ward staff on the roster without a sign-in (invented people). With them the ward can meet every
 * minimum: a 2-in-4 weekend rule gives each person two weekends of the four, so the weekend's
 * registered-nurse minimums (2 + 2 + 2 per day, 12 per weekend) need at least 12 nurses and the
 * healthcare assistants' (1 + 1 + 1 per day, 6 per weekend) at least 6, with some room for leave.
 */
export const DEMO_EXTRA_WARD_STAFF: { name: string; note: string }[] = [
  { name: 'Elin Marwood', note: 'Staff nurse' },
  { name: 'Joel Pemberton', note: 'Staff nurse' },
  { name: 'Rosa Quintrell', note: 'Staff nurse' },
  { name: 'Tariq Osei', note: 'Healthcare assistant' },
];

/**
 * The ward's study day (invented): eight of its fourteen registered nurses attend, on approved leave,
 * so the day cannot meet its nurse minimums (3 + 2 + 2 = 7 nurses for six left). The staffing proof
 * shows the fewest shifts below minimum any roster can have, and the explanations say who is away.
 */
export const DEMO_STUDY_DAY = {
  day: 10,
  note: 'Ward study day',
  people: [
    'Priya Wendover',
    'Tomasz Kellaway',
    'Beth Lindqvist',
    'Seun Adeyemi',
    'Callum Reeves',
    'Elin Marwood',
    'Joel Pemberton',
    'Rosa Quintrell',
  ],
};

/** Skill codes of a demo person, read from the note that describes them. */
export function demoSkillsOf(unit: DemoUnitKey, note: string): string[] {
  if (unit === 'ward') return /nurse/i.test(note) ? ['RN'] : ['HCA'];
  const languages = /\(([^)]*)\)/
    .exec(note)?.[1]
    .split(',')
    .map((s) => s.trim()) ?? ['English'];
  return [...new Set(['EN', ...languages.map((l) => LANGUAGE_SKILL[l]).filter(Boolean)])];
}

/** The Monday on or after `today` + 21 days ("YYYY-MM-DD" in, "YYYY-MM-DD" out). */
export function demoPeriodStart(today: string): string {
  const earliest = addDays(today, 21);
  const weekday = new Date(`${earliest}T00:00:00Z`).getUTCDay(); // 0 = Sunday, 1 = Monday
  return addDays(earliest, (8 - weekday) % 7);
}

type Need = { shift: string; skill: string | null; min: number; target: number };
const WEEKDAYS = [1, 2, 3, 4, 5];
const EVERY_DAY = [0, 1, 2, 3, 4, 5, 6];

/** Weekly cover pattern per unit: the same needs on the listed weekdays (0 = Sunday). */
const DEMO_PATTERN: Record<DemoUnitKey, { weekdays: number[]; needs: Need[] }[]> = {
  ward: [
    {
      weekdays: WEEKDAYS,
      needs: [{ shift: 'E', skill: 'RN', min: 3, target: 3 }],
    },
    {
      // Fewer planned admissions and discharges at the weekend (invented): two nurses on the early.
      weekdays: [0, 6],
      needs: [{ shift: 'E', skill: 'RN', min: 2, target: 3 }],
    },
    {
      weekdays: EVERY_DAY,
      needs: [
        { shift: 'E', skill: 'HCA', min: 1, target: 2 },
        { shift: 'L', skill: 'RN', min: 2, target: 3 },
        { shift: 'L', skill: 'HCA', min: 1, target: 1 },
        { shift: 'N', skill: 'RN', min: 2, target: 2 },
        { shift: 'N', skill: 'HCA', min: 1, target: 1 },
      ],
    },
  ],
  contact: [
    {
      weekdays: WEEKDAYS,
      needs: [
        { shift: 'D', skill: null, min: 4, target: 5 },
        { shift: 'D', skill: 'FR', min: 1, target: 1 },
        { shift: 'D', skill: 'PL', min: 1, target: 1 },
        { shift: 'D', skill: 'GA', min: 0, target: 1 },
        { shift: 'EV', skill: null, min: 2, target: 3 },
      ],
    },
    {
      weekdays: [6],
      needs: [
        { shift: 'D', skill: null, min: 2, target: 3 },
        { shift: 'EV', skill: null, min: 1, target: 2 },
      ],
    },
  ],
};

/** Seeds the planning data inside the demo seed's transaction. */
export async function seedDemoPlanning(
  em: EntityManager,
  organisationId: string,
  units: Record<DemoUnitKey, UnitEntity>,
  usersByEmail: Map<string, UserEntity>,
  now: Date,
): Promise<void> {
  const skills = new Map<string, SkillEntity>();
  for (const s of DEMO_SKILLS)
    skills.set(s.code, await em.save(em.create(SkillEntity, { organisationId, ...s })));

  const contracts = new Map<string, ContractEntity>();
  for (const c of DEMO_CONTRACTS) {
    contracts.set(
      c.name,
      await em.save(em.create(ContractEntity, { organisationId, unitId: null, name: c.name, ...c.rules })),
    );
  }

  for (const key of Object.keys(units) as DemoUnitKey[]) {
    const unit = units[key];
    const shifts = new Map<string, ShiftTypeEntity>();
    for (const st of DEMO_SHIFT_TYPES[key]) {
      shifts.set(st.code, await em.save(em.create(ShiftTypeEntity, { unitId: unit.id, ...st })));
    }
    for (const block of DEMO_PATTERN[key]) {
      for (const weekday of block.weekdays) {
        for (const n of block.needs) {
          await em.save(
            em.create(CoverPatternRowEntity, {
              unitId: unit.id,
              weekday,
              shiftTypeId: shifts.get(n.shift)!.id,
              skillId: n.skill ? skills.get(n.skill)!.id : null,
              min: n.min,
              target: n.target,
            }),
          );
        }
      }
    }

    const staffMembers: StaffMemberEntity[] = [];
    for (const u of DEMO_USERS.filter((d) => d.unit === key && d.role === 'staff')) {
      const user = usersByEmail.get(u.email)!;
      const member = await em.save(
        em.create(StaffMemberEntity, {
          unitId: unit.id,
          userId: user.id,
          name: u.displayName,
          email: u.email,
          contractId: contracts.get(PART_TIME.has(u.displayName) ? 'Part-time 22.5 h' : 'Full-time 37.5 h')!
            .id,
          hourlyCost: key === 'ward' ? (/nurse/i.test(u.note) ? 24.5 : 15.8) : 16.2,
          active: true,
          skills: demoSkillsOf(key, u.note).map((code) => skills.get(code)!),
        }),
      );
      staffMembers.push(member);
    }
    for (const extra of key === 'ward' ? DEMO_EXTRA_WARD_STAFF : []) {
      staffMembers.push(
        await em.save(
          em.create(StaffMemberEntity, {
            unitId: unit.id,
            userId: null,
            name: extra.name,
            email: `${extra.name.toLowerCase().replace(/\s+/g, '.')}@example.com`,
            contractId: contracts.get(PART_TIME.has(extra.name) ? 'Part-time 22.5 h' : 'Full-time 37.5 h')!
              .id,
            hourlyCost: /nurse/i.test(extra.note) ? 24.5 : 15.8,
            active: true,
            skills: demoSkillsOf('ward', extra.note).map((code) => skills.get(code)!),
          }),
        ),
      );
    }

    const startDate = demoPeriodStart(localDate(now, unit.timeZone));
    const period = await em.save(
      em.create(RosterPeriodEntity, { unitId: unit.id, startDate, days: 28, status: 'draft' }),
    );
    const manager = DEMO_USERS.find((d) => d.unit === key && d.role === 'manager');
    await seedDemoStaffInput(
      em,
      key,
      period,
      staffMembers,
      shifts,
      manager ? usersByEmail.get(manager.email) : undefined,
      now,
    );
    // An event on the ward's second Wednesday: one more registered nurse on the early shift.
    if (key === 'ward') {
      const decidedBy = manager ? usersByEmail.get(manager.email) : undefined;
      const date = addDays(startDate, DEMO_STUDY_DAY.day);
      for (const name of DEMO_STUDY_DAY.people) {
        await em.save(
          em.create(LeaveRequestEntity, {
            staffMemberId: staffMembers.find((m) => m.name === name)!.id,
            startDate: date,
            endDate: date,
            type: 'other',
            status: 'approved',
            note: DEMO_STUDY_DAY.note,
            decisionNote: null,
            decidedById: decidedBy?.id ?? null,
            decidedAt: now,
          }),
        );
      }
      await em.save(
        em.create(CoverOverrideEntity, {
          unitId: unit.id,
          date: addDays(startDate, 9),
          shiftTypeId: shifts.get('E')!.id,
          skillId: skills.get('RN')!.id,
          min: 4,
          target: 4,
        }),
      );
    }
  }
}
