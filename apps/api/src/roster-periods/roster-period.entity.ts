import { ROSTER_PERIOD_STATUSES, type RosterPeriodStatus } from '@rotaplex/contracts';
import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  VersionColumn,
} from 'typeorm';
import { UnitEntity } from '../units/unit.entity';

/** The days of one unit a roster is built for: draft, then published, then archived. */
@Entity('roster_periods')
@Check('CHK_roster_periods_status', `"status" IN (${ROSTER_PERIOD_STATUSES.map((s) => `'${s}'`).join(', ')})`)
@Index('IDX_roster_periods_unit_start', ['unitId', 'startDate'])
export class RosterPeriodEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  unitId!: string;

  @ManyToOne(() => UnitEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'unitId' })
  unit?: UnitEntity;

  /** "YYYY-MM-DD" in the unit's time zone. */
  @Column({ type: 'varchar', length: 10 })
  startDate!: string;

  @Column({ type: 'integer' })
  days!: number;

  @Column({ type: 'varchar', length: 16, default: 'draft' })
  status!: RosterPeriodStatus;

  @CreateDateColumn({ type: 'datetime' })
  createdAt!: Date;

  @Column({ type: 'datetime', nullable: true })
  publishedAt!: Date | null;

  /** Date requests one staff member may make in this period (set by the manager). */
  @Column({ type: 'integer', default: 5 })
  requestLimit!: number;

  @VersionColumn({ type: 'integer' })
  version!: number;
}
