import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import { PUBLISH_LEAD_DAYS_DEFAULT } from '@rotaplex/contracts';
import { OrganisationEntity } from '../organisation/organisation.entity';

/** A ward, store or team: the place a roster is planned for. Has an IANA time zone. */
@Entity('units')
@Index('UQ_units_organisation_name', ['organisationId', 'name'], { unique: true })
export class UnitEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  organisationId!: string;

  @ManyToOne(() => OrganisationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisationId' })
  organisation?: OrganisationEntity;

  @Column({ type: 'varchar', length: 200 })
  name!: string;

  /** IANA time zone name, e.g. Europe/London. */
  @Column({ type: 'varchar', length: 64 })
  timeZone!: string;

  /**
   * Days before a period starts by which its roster should be published: PUBLISH_LEAD_DAYS_DEFAULT,
   * the 6 weeks many hospitals aim for (Drake, J Adv Nurs 2018;74(8):1831-38).
   */
  @Column({ type: 'integer', default: PUBLISH_LEAD_DAYS_DEFAULT })
  publishLeadDays!: number;

  @CreateDateColumn({ type: 'datetime' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime' })
  updatedAt!: Date;
}
