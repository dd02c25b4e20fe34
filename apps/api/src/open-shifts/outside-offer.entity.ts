import { OUTSIDE_OFFER_STATUSES, type OutsideOfferStatus } from '@rotaplex/contracts';
import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { ShiftTypeEntity } from '../shift-types/shift-type.entity';
import { UserEntity } from '../users/user.entity';

/**
 * An open shift of a published roster offered to bank or agency staff outside the roster: to whom,
 * by whom, and whether it was filled (then it counts `people` fewer open) or withdrawn. At most one
 * offer of a shift is current (offered or filled); withdrawn ones stay as history. The audit trail
 * records every change.
 */
@Entity('open_shift_outside_offers')
@Check(
  'CHK_open_shift_outside_offers_status',
  `"status" IN (${OUTSIDE_OFFER_STATUSES.map((s) => `'${s}'`).join(', ')})`,
)
@Index('IDX_open_shift_outside_offers_period_date', ['rosterPeriodId', 'date'])
export class OutsideOfferEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  rosterPeriodId!: string;

  @ManyToOne(() => RosterPeriodEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'rosterPeriodId' })
  rosterPeriod?: RosterPeriodEntity;

  @Column({ type: 'varchar', length: 10 })
  date!: string;

  @Column({ type: 'varchar' })
  shiftTypeId!: string;

  @ManyToOne(() => ShiftTypeEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'shiftTypeId' })
  shiftType?: ShiftTypeEntity;

  /** The skill of the need (null: anyone). A uuid: a varchar on SQLite, PostgreSQL's uuid there. */
  @Column({ type: 'uuid', nullable: true })
  skillId!: string | null;

  @Column({ type: 'varchar', length: 200 })
  offeredTo!: string;

  @Column({ type: 'varchar', length: 500, nullable: true })
  note!: string | null;

  @Column({ type: 'varchar', length: 12 })
  status!: OutsideOfferStatus;

  /** Filled: how many people from outside work it. */
  @Column({ type: 'integer', nullable: true })
  people!: number | null;

  @Column({ type: 'varchar', nullable: true })
  offeredById!: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'offeredById' })
  offeredBy?: UserEntity | null;

  /** The offering user's name at the time (kept when the user is gone). */
  @Column({ type: 'varchar', length: 200 })
  offeredByName!: string;

  @Column({ type: 'datetime' })
  offeredAt!: Date;

  @Column({ type: 'datetime' })
  updatedAt!: Date;
}
