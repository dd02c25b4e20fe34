import { Injectable } from '@nestjs/common';
import { type DateRequestDto, type LeaveDto, type Page, type RequestPeriodDto } from '@rotaplex/contracts';
import { type RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { ShiftTypesService } from '../shift-types/shift-types.service';
import { type StaffMemberEntity } from '../staff/staff-member.entity';
import { StaffService } from '../staff/staff.service';
import { UsersService } from '../users/users.service';
import { type DateRequestEntity, type LeaveRequestEntity } from './requests.entities';

const iso = (d: Date | null): string | null => (d ? d.toISOString() : null);

/** A note as stored: trimmed, and null when empty. */
export const cleanNote = (note: string | null | undefined): string | null => {
  const t = note?.trim();
  return t ? t : null;
};

/** Rows of date requests and leave as the API answers them (with names and shift codes). */
@Injectable()
export class RequestDtos {
  constructor(
    private readonly staff: StaffService,
    private readonly users: UsersService,
    private readonly shiftTypes: ShiftTypesService,
  ) {}

  async dateRequests(rows: DateRequestEntity[]): Promise<DateRequestDto[]> {
    const staff = await this.staffByIds(rows.map((r) => r.staffMemberId));
    const shiftIds = [...new Set(rows.map((r) => r.shiftTypeId).filter((s): s is string => s !== null))];
    const shifts = new Map((await this.shiftTypes.byIds(shiftIds)).map((s) => [s.id, s]));
    return rows.map((r) => ({
      id: r.id,
      rosterPeriodId: r.rosterPeriodId,
      staffMemberId: r.staffMemberId,
      staffName: staff.get(r.staffMemberId)?.name ?? '',
      unitId: staff.get(r.staffMemberId)?.unitId ?? '',
      date: r.date,
      kind: r.kind,
      shiftTypeId: r.shiftTypeId,
      shiftTypeCode: r.shiftTypeId ? (shifts.get(r.shiftTypeId)?.code ?? null) : null,
      note: r.note,
      createdAt: r.createdAt.toISOString(),
    }));
  }

  async leave(rows: LeaveRequestEntity[]): Promise<LeaveDto[]> {
    const staff = await this.staffByIds(rows.map((r) => r.staffMemberId));
    const deciderIds = [...new Set(rows.map((r) => r.decidedById).filter((s): s is string => s !== null))];
    const deciders = new Map((await this.users.byIds(deciderIds)).map((u) => [u.id, u.displayName]));
    return rows.map((r) => ({
      id: r.id,
      staffMemberId: r.staffMemberId,
      staffName: staff.get(r.staffMemberId)?.name ?? '',
      unitId: staff.get(r.staffMemberId)?.unitId ?? '',
      startDate: r.startDate,
      endDate: r.endDate,
      type: r.type,
      status: r.status,
      note: r.note,
      decisionNote: r.decisionNote,
      decidedAt: iso(r.decidedAt),
      decidedBy: r.decidedById ? (deciders.get(r.decidedById) ?? null) : null,
      createdAt: r.createdAt.toISOString(),
    }));
  }

  private async staffByIds(ids: string[]): Promise<Map<string, StaffMemberEntity>> {
    const unique = [...new Set(ids)];
    return new Map((await this.staff.byIds(unique)).map((s) => [s.id, s]));
  }
}

export function toPeriodDto(p: RosterPeriodEntity): RequestPeriodDto {
  return {
    id: p.id,
    unitId: p.unitId,
    startDate: p.startDate,
    days: p.days,
    status: p.status,
    requestLimit: p.requestLimit,
  };
}

export function emptyPage<T>(query: { page: number; pageSize: number }): Page<T> {
  return { items: [], total: 0, page: query.page, pageSize: query.pageSize };
}
