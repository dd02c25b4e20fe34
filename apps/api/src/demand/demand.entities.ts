import type { ContactCentreDemandDto, WardDemandDto } from '@rotaplex/contracts';
import {
  Column,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  OneToOne,
  PrimaryColumn,
  PrimaryGeneratedColumn,
} from 'typeorm';
import { RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { UnitEntity } from '../units/unit.entity';
import { UserEntity } from '../users/user.entity';

/**
 * A unit's demand: the contact-centre forecast and the ward's patients and ratios, each stored as
 * one JSON document (validated as a whole on every write; see dto/demand.dto.ts). Shift type and
 * skill ids inside are checked on write and skipped on read when they no longer exist.
 */
@Entity('unit_demands')
export class UnitDemandEntity {
  @PrimaryColumn({ type: 'varchar' })
  unitId!: string;

  @OneToOne(() => UnitEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'unitId' })
  unit?: UnitEntity;

  @Column({ type: 'simple-json', nullable: true })
  contactCentre!: ContactCentreDemandDto | null;

  @Column({ type: 'simple-json', nullable: true })
  ward!: WardDemandDto | null;

  @Column({ type: 'datetime' })
  updatedAt!: Date;

  /** The user who saved it last; null for the system (demo seed) or a user deleted since. */
  @Column({ type: 'varchar', nullable: true })
  updatedById!: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'updatedById' })
  updatedBy?: UserEntity | null;
}

/** One accepted demand plan: who wrote which cover needs into a period, and what was there before. */
@Entity('demand_acceptances')
@Index('IDX_demand_acceptances_period_at', ['rosterPeriodId', 'at'])
export class DemandAcceptanceEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  rosterPeriodId!: string;

  @ManyToOne(() => RosterPeriodEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'rosterPeriodId' })
  rosterPeriod?: RosterPeriodEntity;

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

  /** Cover-need overrides written. */
  @Column({ type: 'integer' })
  written!: number;

  @Column({ type: 'varchar', length: 1000 })
  summary!: string;

  /** The overrides of the same dates, shift types and skills before the change. */
  @Column({ type: 'simple-json', nullable: true })
  before!: unknown;

  @Column({ type: 'simple-json', nullable: true })
  after!: unknown;
}
