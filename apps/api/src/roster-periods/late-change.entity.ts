import { CHANGE_INITIATORS, type ChangeInitiator, type RosterChangeKind } from '@rotaplex/contracts';
import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { RosterPeriodEntity } from './roster-period.entity';

/**
 * One cell of a published roster changed inside the organisation's notice window (written only by
 * `PeriodWriter`, in the transaction of the change). With predictability pay recorded, `payHours`
 * holds the hours recorded as owed for an employer-initiated change; null otherwise. People and
 * shifts are kept by name as they were, so the record outlives later renames.
 */
@Entity('late_changes')
@Check(
  'CHK_late_changes_initiated_by',
  `"initiatedBy" IN (${CHANGE_INITIATORS.map((s) => `'${s}'`).join(', ')})`,
)
@Index('IDX_late_changes_period', ['rosterPeriodId', 'version'])
export class LateChangeEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  rosterPeriodId!: string;

  @ManyToOne(() => RosterPeriodEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'rosterPeriodId' })
  rosterPeriod?: RosterPeriodEntity;

  /** The period's version the change made (roster_period_changes.version). */
  @Column({ type: 'integer' })
  version!: number;

  @Column({ type: 'varchar', length: 16 })
  kind!: RosterChangeKind;

  @Column({ type: 'varchar', length: 16 })
  initiatedBy!: ChangeInitiator;

  @Column({ type: 'varchar' })
  staffMemberId!: string;

  @Column({ type: 'varchar', length: 200 })
  staffName!: string;

  @Column({ type: 'varchar', length: 10 })
  date!: string;

  @Column({ type: 'varchar', length: 200, nullable: true })
  shiftBefore!: string | null;

  @Column({ type: 'varchar', length: 200, nullable: true })
  shiftAfter!: string | null;

  @Column({ type: 'integer' })
  daysNotice!: number;

  @Column({ type: 'integer' })
  noticeWindowDays!: number;

  @Column({ type: 'real', nullable: true })
  payHours!: number | null;

  @Column({ type: 'varchar', length: 500, nullable: true })
  payRule!: string | null;

  @Column({ type: 'varchar', length: 500 })
  reason!: string;

  @Column({ type: 'varchar', length: 200 })
  actorName!: string;

  @Column({ type: 'datetime' })
  at!: Date;
}
