import { AUDIT_KINDS, type AuditKind } from '@rotaplex/contracts';
import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { UserEntity } from '../users/user.entity';

/** One change to a roster period once it is published: who, when, what, before and after. */
@Entity('audit_entries')
@Check('CHK_audit_entries_kind', `"kind" IN (${AUDIT_KINDS.map((s) => `'${s}'`).join(', ')})`)
@Index('IDX_audit_entries_period_at', ['rosterPeriodId', 'at'])
export class AuditEntryEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  rosterPeriodId!: string;

  @ManyToOne(() => RosterPeriodEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'rosterPeriodId' })
  rosterPeriod?: RosterPeriodEntity;

  /** The user who made the change; null for the system or a user deleted since. */
  @Column({ type: 'varchar', nullable: true })
  actorUserId!: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'actorUserId' })
  actorUser?: UserEntity | null;

  /** The actor's name at the time (kept when the user is gone). */
  @Column({ type: 'varchar', length: 200 })
  actorName!: string;

  @Column({ type: 'varchar', length: 32 })
  kind!: AuditKind;

  @Column({ type: 'datetime' })
  at!: Date;

  @Column({ type: 'varchar', length: 1000 })
  summary!: string;

  @Column({ type: 'simple-json', nullable: true })
  before!: unknown;

  @Column({ type: 'simple-json', nullable: true })
  after!: unknown;
}
