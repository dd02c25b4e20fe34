import {
  AVAILABILITY_STATUSES,
  type AvailabilityStatus,
  DATE_REQUEST_KINDS,
  DAY_PARTS,
  type DateRequestKind,
  type DayPart,
  LEAVE_STATUSES,
  LEAVE_TYPES,
  type LeaveStatus,
  type LeaveType,
} from '@rotaplex/contracts';
import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
} from 'typeorm';
import { RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { ShiftTypeEntity } from '../shift-types/shift-type.entity';
import { StaffMemberEntity } from '../staff/staff-member.entity';
import { UserEntity } from '../users/user.entity';

const list = (values: readonly string[]) => values.map((v) => `'${v}'`).join(', ');

/**
 * One cell of a staff member's recurring weekly availability that is not "available"
 * (a missing cell means available). Weekday 0 = Sunday … 6 = Saturday.
 */
@Entity('availability_cells')
@Index('UQ_availability_cells_staff_weekday_part', ['staffMemberId', 'weekday', 'part'], { unique: true })
@Check('CHK_availability_cells_weekday', `"weekday" BETWEEN 0 AND 6`)
@Check('CHK_availability_cells_part', `"part" IN (${list(DAY_PARTS)})`)
@Check('CHK_availability_cells_status', `"status" IN (${list(AVAILABILITY_STATUSES)})`)
export class AvailabilityCellEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  staffMemberId!: string;

  @ManyToOne(() => StaffMemberEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'staffMemberId' })
  staffMember?: StaffMemberEntity;

  @Column({ type: 'integer' })
  weekday!: number;

  @Column({ type: 'varchar', length: 8 })
  part!: DayPart;

  @Column({ type: 'varchar', length: 16 })
  status!: AvailabilityStatus;
}

/** A staff member's wish for one date of a draft period: shift on, shift off or day off. */
@Entity('date_requests')
@Index('UQ_date_requests_period_staff_date', ['rosterPeriodId', 'staffMemberId', 'date'], { unique: true })
@Check('CHK_date_requests_kind', `"kind" IN (${list(DATE_REQUEST_KINDS)})`)
export class DateRequestEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  rosterPeriodId!: string;

  @ManyToOne(() => RosterPeriodEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'rosterPeriodId' })
  rosterPeriod?: RosterPeriodEntity;

  @Column({ type: 'varchar' })
  staffMemberId!: string;

  @ManyToOne(() => StaffMemberEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'staffMemberId' })
  staffMember?: StaffMemberEntity;

  /** "YYYY-MM-DD", a day of the period. */
  @Column({ type: 'varchar', length: 10 })
  date!: string;

  @Column({ type: 'varchar', length: 16 })
  kind!: DateRequestKind;

  @Column({ type: 'varchar', nullable: true })
  shiftTypeId!: string | null;

  @ManyToOne(() => ShiftTypeEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'shiftTypeId' })
  shiftType?: ShiftTypeEntity | null;

  @Column({ type: 'text', nullable: true })
  note!: string | null;

  @CreateDateColumn({ type: 'datetime' })
  createdAt!: Date;
}

/** A leave request over a range of dates (inclusive); approved leave blocks assignment. */
@Entity('leave_requests')
@Index('IDX_leave_requests_staff_start', ['staffMemberId', 'startDate'])
@Check('CHK_leave_requests_type', `"type" IN (${list(LEAVE_TYPES)})`)
@Check('CHK_leave_requests_status', `"status" IN (${list(LEAVE_STATUSES)})`)
@Check('CHK_leave_requests_range', `"endDate" >= "startDate"`)
export class LeaveRequestEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  staffMemberId!: string;

  @ManyToOne(() => StaffMemberEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'staffMemberId' })
  staffMember?: StaffMemberEntity;

  @Column({ type: 'varchar', length: 10 })
  startDate!: string;

  /** Last day of leave, inclusive. */
  @Column({ type: 'varchar', length: 10 })
  endDate!: string;

  @Column({ type: 'varchar', length: 16 })
  type!: LeaveType;

  @Column({ type: 'varchar', length: 16, default: 'pending' })
  status!: LeaveStatus;

  @Column({ type: 'text', nullable: true })
  note!: string | null;

  @Column({ type: 'text', nullable: true })
  decisionNote!: string | null;

  @Column({ type: 'varchar', nullable: true })
  decidedById!: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'decidedById' })
  decidedBy?: UserEntity | null;

  @Column({ type: 'datetime', nullable: true })
  decidedAt!: Date | null;

  @CreateDateColumn({ type: 'datetime' })
  createdAt!: Date;
}
