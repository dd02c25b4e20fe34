import { type ContactCentreDemandDto, type WardDemandDto } from '@rotaplex/contracts';
import { type EntityManager } from 'typeorm';
import { UnitDemandEntity } from '../demand/demand.entities';
import { ShiftTypeEntity } from '../shift-types/shift-type.entity';
import { SkillEntity } from '../skills/skill.entity';
import { type UnitEntity } from '../units/unit.entity';

/**
 * Invented demand for the demo units. The contact centre's forecast week, planned with its Day and
 * Evening shifts, asks for about what its typed cover needs ask (weekdays Day 4-6, Evening 3-5;
 * Saturdays less; closed on Sundays). The ward's patients and ratios are invented demo values, not
 * a staffing standard.
 */

/** Contacts per half hour from 08:00 to 21:30 (28 values), invented. */
const WEEKDAY_CONTACTS = [
  3, 4, 6, 7, 9, 10, 11, 10, 9, 8, 7, 7, 8, 8, 8, 7, 6, 5, 4, 3, 2, 2, 2, 1, 1, 1, 1, 1,
];
const SATURDAY_CONTACTS = [
  1, 2, 3, 3, 4, 4, 5, 4, 4, 4, 3, 3, 4, 4, 4, 3, 3, 2, 2, 1, 1, 1, 1, 1, 0, 0, 0, 0,
];

function halfHours(contacts: number[], ahtSeconds: number) {
  return contacts
    .map((n, i) => {
      const minute = 8 * 60 + 30 * i;
      const start = `${String(Math.floor(minute / 60)).padStart(2, '0')}:${minute % 60 === 0 ? '00' : '30'}`;
      return { start, contacts: n, ahtSeconds };
    })
    .filter((i) => i.contacts > 0);
}

export const DEMO_CONTACT_DEMAND: Omit<ContactCentreDemandDto, 'shiftTypeIds'> = {
  intervalMinutes: 30,
  skillId: null,
  service: { targetPercent: 80, targetSeconds: 20, maxOccupancyPercent: 85, shrinkagePercent: 30 },
  pattern: [
    ...[1, 2, 3, 4, 5].map((weekday) => ({ weekday, intervals: halfHours(WEEKDAY_CONTACTS, 300) })),
    { weekday: 6, intervals: halfHours(SATURDAY_CONTACTS, 270) },
  ],
  dates: [],
  maxPeoplePerDay: null,
};

/** Expected patients per shift (every day), invented: a 20-bed acute medical ward. */
const DEMO_PATIENTS: Record<string, { low: number; medium: number; high: number }> = {
  E: { low: 12, medium: 6, high: 2 },
  L: { low: 12, medium: 5, high: 2 },
  N: { low: 11, medium: 5, high: 2 },
};

const DEMO_RATIO_SOURCE =
  'Invented demo values, not a staffing standard: replace them with what your local law and professional standards require.';

/** Seeds both units' demand inside the demo seed's transaction (after the shift types and skills). */
export async function seedDemoDemand(em: EntityManager, units: { ward: UnitEntity; contact: UnitEntity }) {
  const shiftsOf = async (unit: UnitEntity) =>
    new Map((await em.findBy(ShiftTypeEntity, { unitId: unit.id })).map((s) => [s.code, s.id]));
  const skills = new Map(
    (await em.findBy(SkillEntity, { organisationId: units.ward.organisationId })).map((s) => [s.code, s.id]),
  );
  const wardShifts = await shiftsOf(units.ward);
  const ward: WardDemandDto = {
    patients: [0, 1, 2, 3, 4, 5, 6].flatMap((weekday) =>
      Object.entries(DEMO_PATIENTS)
        .filter(([code]) => wardShifts.has(code))
        .map(([code, patients]) => ({ weekday, date: null, shiftTypeId: wardShifts.get(code)!, patients })),
    ),
    ratios: [
      {
        skillId: skills.get('RN')!,
        patientsPerStaff: { low: 8, medium: 6, high: 4 },
        minimumPerShift: 2,
        source: DEMO_RATIO_SOURCE,
      },
      {
        skillId: skills.get('HCA')!,
        patientsPerStaff: { low: 12, medium: 10, high: 6 },
        minimumPerShift: 1,
        source: DEMO_RATIO_SOURCE,
      },
    ].filter((r) => r.skillId),
  };
  const now = new Date();
  await em.save(
    em.create(UnitDemandEntity, {
      unitId: units.ward.id,
      contactCentre: null,
      ward,
      updatedAt: now,
      updatedById: null,
    }),
  );
  await em.save(
    em.create(UnitDemandEntity, {
      unitId: units.contact.id,
      contactCentre: { ...DEMO_CONTACT_DEMAND, shiftTypeIds: [] },
      ward: null,
      updatedAt: now,
      updatedById: null,
    }),
  );
}
