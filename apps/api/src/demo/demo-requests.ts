import {
  type AvailabilityStatus,
  type DateRequestKind,
  type DayPart,
  type LeaveStatus,
  type LeaveType,
} from '@rotaplex/contracts';
import { type EntityManager } from 'typeorm';
import { AvailabilityCellEntity, DateRequestEntity, LeaveRequestEntity } from '../requests/requests.entities';
import { type RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { addDays } from '../common/dates';
import { type ShiftTypeEntity } from '../shift-types/shift-type.entity';
import { type StaffMemberEntity } from '../staff/staff-member.entity';
import { type UserEntity } from '../users/user.entity';
import { type DemoUnitKey } from './demo-data';

/**
 * Invented staff input for each demo unit's four-week draft period (day numbers count from the
 * period's first day, a Monday). It makes the demo roster interesting:
 * - several people ask for the same days off, so not every request can be met;
 * - in the contact centre Chloe Dubois is the only French speaker and has approved leave on the
 *   second Monday (day 7: next to the Sunday, which has no contact-centre cover, so her two days off
 *   in a row still hold), so that day's French need on the Day shift is short on purpose and the
 *   solve's explanation says she is on leave (checked by apps/api/test/requests.e2e-spec.ts);
 * - some leave is pending, so the manager has something to decide.
 */
interface DemoDateRequest {
  person: string;
  day: number;
  kind: DateRequestKind;
  shift?: string;
  note?: string;
}
interface DemoLeave {
  person: string;
  from: number;
  to: number;
  type: LeaveType;
  status: LeaveStatus;
  note?: string;
}
interface DemoAvailability {
  person: string;
  weekdays: number[];
  part: DayPart;
  status: AvailabilityStatus;
}

/** The day of the contact centre's demo period whose French need is short because of leave. */
export const DEMO_SHORT_NEED_DAY = 7;
export const DEMO_ON_LEAVE_PERSON = 'Chloe Dubois';

const ALL_WEEK = [0, 1, 2, 3, 4, 5, 6];

export const DEMO_STAFF_INPUT: Record<
  DemoUnitKey,
  { requests: DemoDateRequest[]; leave: DemoLeave[]; availability: DemoAvailability[] }
> = {
  ward: {
    requests: [
      { person: 'Robin Tallis', day: 4, kind: 'dayOff', note: 'Family visit' },
      { person: 'Robin Tallis', day: 15, kind: 'shiftOn', shift: 'E' },
      // The first Saturday: both night nurses want it off.
      { person: 'Mei Castell', day: 5, kind: 'dayOff' },
      { person: 'Fatima Qadir', day: 5, kind: 'dayOff' },
      // The second Saturday: four registered nurses ask for it off.
      { person: 'Priya Wendover', day: 12, kind: 'dayOff' },
      { person: 'Tomasz Kellaway', day: 12, kind: 'dayOff' },
      { person: 'Seun Adeyemi', day: 12, kind: 'dayOff' },
      { person: 'Callum Reeves', day: 12, kind: 'dayOff', note: 'Wedding' },
      { person: 'Owen Treharne', day: 2, kind: 'shiftOn', shift: 'N' },
      { person: 'Ines Moreau', day: 3, kind: 'shiftOff', shift: 'E' },
      { person: 'Kwame Asante', day: 19, kind: 'shiftOn', shift: 'L' },
    ],
    leave: [
      { person: 'Grace Holloway', from: 14, to: 18, type: 'annual', status: 'approved' },
      { person: 'Robin Tallis', from: 24, to: 25, type: 'annual', status: 'approved' },
      { person: 'Declan Marsh', from: 19, to: 20, type: 'annual', status: 'pending', note: 'Moving house' },
      { person: 'Hannah Pryce', from: 12, to: 13, type: 'annual', status: 'declined' },
      { person: 'Ravi Chandran', from: 8, to: 9, type: 'other', status: 'approved', note: 'Jury service' },
    ],
    availability: [
      { person: 'Mei Castell', weekdays: ALL_WEEK, part: 'early', status: 'unavailable' },
      { person: 'Mei Castell', weekdays: ALL_WEEK, part: 'late', status: 'prefer-not' },
      { person: 'Robin Tallis', weekdays: [5, 6], part: 'night', status: 'prefer-not' },
      { person: 'Robin Tallis', weekdays: [3], part: 'early', status: 'unavailable' },
      { person: 'Lucy Fenwick', weekdays: [1, 2], part: 'night', status: 'unavailable' },
    ],
  },
  contact: {
    requests: [
      // Jakub is the only Polish speaker, needed every weekday: this one cannot be met.
      { person: 'Jakub Kowal', day: 2, kind: 'dayOff', note: 'Appointment' },
      { person: DEMO_ON_LEAVE_PERSON, day: 4, kind: 'dayOff' },
      { person: 'Sofia Marin', day: 5, kind: 'dayOff' },
      { person: 'Lukas Weber', day: 5, kind: 'dayOff' },
      { person: 'Siobhan Reilly', day: 5, kind: 'dayOff' },
      { person: 'Siobhan Reilly', day: 1, kind: 'shiftOn', shift: 'EV' },
      { person: 'Marco Bellini', day: 3, kind: 'shiftOff', shift: 'D' },
    ],
    leave: [
      {
        person: DEMO_ON_LEAVE_PERSON,
        from: DEMO_SHORT_NEED_DAY,
        to: DEMO_SHORT_NEED_DAY,
        type: 'annual',
        status: 'approved',
      },
      { person: 'Eoin Kavanagh', from: 15, to: 16, type: 'annual', status: 'pending' },
    ],
    availability: [
      { person: 'Ana Ferreira', weekdays: [1, 3], part: 'late', status: 'unavailable' },
      { person: 'Yasmin Haddad', weekdays: [5], part: 'late', status: 'prefer-not' },
    ],
  },
};

/** Seeds one unit's staff input for its demo period, inside the demo seed's transaction. */
export async function seedDemoStaffInput(
  em: EntityManager,
  key: DemoUnitKey,
  period: RosterPeriodEntity,
  staff: StaffMemberEntity[],
  shifts: Map<string, ShiftTypeEntity>,
  decidedBy: UserEntity | undefined,
  now: Date,
): Promise<void> {
  const byName = new Map(staff.map((s) => [s.name, s]));
  const person = (name: string) => {
    const s = byName.get(name);
    if (!s) throw new Error(`Demo staff input names an unknown person: ${name}`);
    return s;
  };
  const input = DEMO_STAFF_INPUT[key];
  for (const r of input.requests) {
    await em.save(
      em.create(DateRequestEntity, {
        rosterPeriodId: period.id,
        staffMemberId: person(r.person).id,
        date: addDays(period.startDate, r.day),
        kind: r.kind,
        shiftTypeId: r.shift ? shifts.get(r.shift)!.id : null,
        note: r.note ?? null,
      }),
    );
  }
  for (const l of input.leave) {
    const decided = l.status === 'approved' || l.status === 'declined';
    await em.save(
      em.create(LeaveRequestEntity, {
        staffMemberId: person(l.person).id,
        startDate: addDays(period.startDate, l.from),
        endDate: addDays(period.startDate, l.to),
        type: l.type,
        status: l.status,
        note: l.note ?? null,
        decisionNote: null,
        decidedById: decided ? (decidedBy?.id ?? null) : null,
        decidedAt: decided ? now : null,
      }),
    );
  }
  for (const a of input.availability) {
    for (const weekday of a.weekdays) {
      await em.save(
        em.create(AvailabilityCellEntity, {
          staffMemberId: person(a.person).id,
          weekday,
          part: a.part,
          status: a.status,
        }),
      );
    }
  }
}
