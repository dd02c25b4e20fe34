import { ROLES, type Role } from '@rotaplex/contracts';
import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  JoinColumn,
  JoinTable,
  ManyToMany,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import { OrganisationEntity } from '../organisation/organisation.entity';
import { UnitEntity } from '../units/unit.entity';

/** A person who signs in. E-mail is stored lower-cased; no password hash until the invitation is accepted. */
@Entity('users')
@Check('CHK_users_role', `"role" IN (${ROLES.map((r) => `'${r}'`).join(', ')})`)
export class UserEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  organisationId!: string;

  @ManyToOne(() => OrganisationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisationId' })
  organisation?: OrganisationEntity;

  @Column({ type: 'varchar', length: 254, unique: true })
  email!: string;

  @Column({ type: 'varchar', length: 200 })
  displayName!: string;

  /** argon2id encoded hash (salt and parameters included); null until the invitation is accepted. */
  @Column({ type: 'varchar', nullable: true })
  passwordHash!: string | null;

  @Column({ type: 'varchar', length: 16 })
  role!: Role;

  @Column({ type: 'boolean', default: true })
  active!: boolean;

  @ManyToMany(() => UnitEntity)
  @JoinTable({
    name: 'user_units',
    joinColumn: { name: 'userId', referencedColumnName: 'id' },
    inverseJoinColumn: { name: 'unitId', referencedColumnName: 'id' },
  })
  units!: UnitEntity[];

  @CreateDateColumn({ type: 'datetime' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime' })
  updatedAt!: Date;
}
