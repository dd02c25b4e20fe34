import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { OrganisationEntity } from '../organisation/organisation.entity';

/** A skill a cover need can require (e.g. registered nurse, French speaker). Organisation-wide. */
@Entity('skills')
@Index('UQ_skills_organisation_code', ['organisationId', 'code'], { unique: true })
export class SkillEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  organisationId!: string;

  @ManyToOne(() => OrganisationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisationId' })
  organisation?: OrganisationEntity;

  @Column({ type: 'varchar', length: 16 })
  code!: string;

  @Column({ type: 'varchar', length: 200 })
  name!: string;

  /** A registered (licensed) professional skill: its shortfalls are checked for safe-staffing red flags. */
  @Column({ type: 'boolean', default: false })
  registered!: boolean;
}
