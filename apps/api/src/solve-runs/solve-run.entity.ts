import {
  SOLVE_RUN_MODES,
  SOLVE_RUN_STATUSES,
  type SolveRunModeName,
  type SolveProgressDto,
  type SolveRunResultDto,
  type SolveRunStatus,
  type SolveWeights,
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
import { UserEntity } from '../users/user.entity';

/** One generation of a period's roster by the solver: queued, running, then finished, failed or cancelled. */
@Entity('solve_runs')
@Check('CHK_solve_runs_status', `"status" IN (${SOLVE_RUN_STATUSES.map((s) => `'${s}'`).join(', ')})`)
@Check('CHK_solve_runs_mode', `"mode" IN (${SOLVE_RUN_MODES.map((m) => `'${m}'`).join(', ')})`)
@Index('IDX_solve_runs_period_status', ['rosterPeriodId', 'status'])
export class SolveRunEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  rosterPeriodId!: string;

  @ManyToOne(() => RosterPeriodEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'rosterPeriodId' })
  rosterPeriod?: RosterPeriodEntity;

  @Column({ type: 'varchar', length: 16, default: 'queued' })
  status!: SolveRunStatus;

  /** Generate a draft or repair a published roster; stored so a restart still knows it. */
  @Column({ type: 'varchar', length: 16, default: 'generate' })
  mode!: SolveRunModeName;

  @Column({ type: 'varchar', nullable: true })
  requestedById!: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'requestedById' })
  requestedBy?: UserEntity | null;

  @Column({ type: 'integer' })
  timeLimitSeconds!: number;

  @Column({ type: 'simple-json' })
  weights!: SolveWeights;

  @Column({ type: 'simple-json', nullable: true })
  progress!: SolveProgressDto | null;

  /** Summary of the outcome: objective, bound, gap, quality statement, explanations, terms. */
  @Column({ type: 'simple-json', nullable: true })
  result!: SolveRunResultDto | null;

  @Column({ type: 'text', nullable: true })
  errorMessage!: string | null;

  @CreateDateColumn({ type: 'datetime' })
  createdAt!: Date;

  @Column({ type: 'datetime', nullable: true })
  startedAt!: Date | null;

  @Column({ type: 'datetime', nullable: true })
  finishedAt!: Date | null;
}
