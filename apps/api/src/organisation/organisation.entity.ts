import { NOTICE_WINDOW_DAYS_DEFAULT, PREDICTABILITY_PAY_HOURS_DEFAULT } from '@rotaplex/contracts';
import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

/** The organisation that owns every unit and user. One per installation for now. */
@Entity('organisations')
export class OrganisationEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar', length: 200 })
  name!: string;

  /**
   * Changes to a published roster less than this many days before the shift are marked late
   * (NOTICE_WINDOW_DAYS_DEFAULT: 14, as US fair-workweek laws such as Seattle SMC 14.22 ask).
   */
  @Column({ type: 'integer', default: NOTICE_WINDOW_DAYS_DEFAULT })
  noticeWindowDays!: number;

  /** Records predictability pay for each employer-initiated late change. Off by default. */
  @Column({ type: 'boolean', default: false })
  recordPredictabilityPay!: boolean;

  /** Hours of pay recorded per late change. */
  @Column({ type: 'real', default: PREDICTABILITY_PAY_HOURS_DEFAULT })
  predictabilityPayHours!: number;

  /** The organisation's own rule in words, kept with each entry. */
  @Column({ type: 'varchar', length: 500, default: '' })
  predictabilityPayRule!: string;

  @CreateDateColumn({ type: 'datetime' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime' })
  updatedAt!: Date;
}
