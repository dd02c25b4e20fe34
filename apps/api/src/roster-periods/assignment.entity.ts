import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { RosterPeriodEntity } from './roster-period.entity';
import { ShiftTypeEntity } from '../shift-types/shift-type.entity';
import { StaffMemberEntity } from '../staff/staff-member.entity';

/**
 * One cell of a period's roster: a person works a shift type on a date, or (only when pinned) has
 * the day off. A cell without a row is an unpinned day off. The cells belong to the period: only
 * the period writer (period-writer.ts) writes them, and other modules read them through it.
 */
@Entity('assignments')
@Index('UQ_assignments_period_staff_date', ['rosterPeriodId', 'staffMemberId', 'date'], { unique: true })
export class AssignmentEntity {
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

  /** The shift worked, or null for a pinned day off. */
  @Column({ type: 'varchar', nullable: true })
  shiftTypeId!: string | null;

  @ManyToOne(() => ShiftTypeEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'shiftTypeId' })
  shiftType?: ShiftTypeEntity | null;

  /** Fixed by the manager: a new solve keeps this cell as it is. */
  @Column({ type: 'boolean', default: false })
  pinned!: boolean;
}
