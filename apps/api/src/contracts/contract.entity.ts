import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { type ContractRules } from '@rotaplex/contracts';
import { OrganisationEntity } from '../organisation/organisation.entity';
import { UnitEntity } from '../units/unit.entity';

/** Work rules, per week (see ContractRules in libs/contracts). unitId null: the whole organisation. */
@Entity('contracts')
export class ContractEntity implements ContractRules {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  organisationId!: string;

  @ManyToOne(() => OrganisationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisationId' })
  organisation?: OrganisationEntity;

  @Column({ type: 'varchar', nullable: true })
  unitId!: string | null;

  @ManyToOne(() => UnitEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'unitId' })
  unit?: UnitEntity | null;

  @Column({ type: 'varchar', length: 200 })
  name!: string;

  /** JSON object: shift type code → max shifts per week. */
  @Column({ type: 'simple-json', nullable: true })
  maxShiftsPerType!: Record<string, number> | null;

  @Column({ type: 'integer', nullable: true }) minPaidMinutes!: number | null;
  @Column({ type: 'integer', nullable: true }) maxPaidMinutes!: number | null;
  @Column({ type: 'integer', nullable: true }) targetPaidMinutes!: number | null;
  @Column({ type: 'integer', nullable: true }) maxConsecutiveWorkDays!: number | null;
  @Column({ type: 'integer', nullable: true }) minConsecutiveWorkDays!: number | null;
  @Column({ type: 'integer', nullable: true }) minConsecutiveDaysOff!: number | null;
  @Column({ type: 'integer', nullable: true }) maxWeekends!: number | null;
  @Column({ type: 'integer', nullable: true }) maxConsecutiveNights!: number | null;
  @Column({ type: 'integer', nullable: true }) minRestMinutes!: number | null;
}
