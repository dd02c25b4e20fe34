import { ROSTER_CHANGE_KINDS, type RosterChangeKind } from '@rotaplex/contracts';
import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { UserEntity } from '../users/user.entity';
import { RosterPeriodEntity } from './roster-period.entity';

/**
 * One change of a period's cells (written only by `PeriodWriter`): the version it raised the period
 * to, what kind of change, how many cells, by whom. A stale publish names these in its 409.
 */
@Entity('roster_period_changes')
@Check('CHK_roster_period_changes_kind', `"kind" IN (${ROSTER_CHANGE_KINDS.map((s) => `'${s}'`).join(', ')})`)
@Index('IDX_roster_period_changes_period_version', ['rosterPeriodId', 'version'])
export class RosterPeriodChangeEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  rosterPeriodId!: string;

  @ManyToOne(() => RosterPeriodEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'rosterPeriodId' })
  rosterPeriod?: RosterPeriodEntity;

  /** The period's version after this change. */
  @Column({ type: 'integer' })
  version!: number;

  @Column({ type: 'varchar', length: 16 })
  kind!: RosterChangeKind;

  /** Cells whose shift or pin changed. */
  @Column({ type: 'integer' })
  cells!: number;

  /** The user who made the change; null for the system or a user deleted since. */
  @Column({ type: 'varchar', nullable: true })
  actorUserId!: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'actorUserId' })
  actorUser?: UserEntity | null;

  /** The actor's name at the time (kept when the user is gone). */
  @Column({ type: 'varchar', length: 200 })
  actorName!: string;

  @Column({ type: 'datetime' })
  at!: Date;
}
