import {
  Column,
  Entity,
  Index,
  JoinColumn,
  JoinTable,
  ManyToMany,
  ManyToOne,
  PrimaryGeneratedColumn,
} from 'typeorm';
import { ContractEntity } from '../contracts/contract.entity';
import { SkillEntity } from '../skills/skill.entity';
import { UnitEntity } from '../units/unit.entity';
import { UserEntity } from '../users/user.entity';

/** A person on a unit's roster, optionally linked to the user who signs in as them. */
@Entity('staff_members')
@Index('UQ_staff_members_unit_user', ['unitId', 'userId'], { unique: true })
export class StaffMemberEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  unitId!: string;

  @ManyToOne(() => UnitEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'unitId' })
  unit?: UnitEntity;

  @Column({ type: 'varchar', nullable: true })
  userId!: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'userId' })
  user?: UserEntity | null;

  @Column({ type: 'varchar', length: 200 })
  name!: string;

  @Column({ type: 'varchar', length: 254, nullable: true })
  email!: string | null;

  @Column({ type: 'varchar', nullable: true })
  contractId!: string | null;

  @ManyToOne(() => ContractEntity, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'contractId' })
  contract?: ContractEntity | null;

  @Column({ type: 'real', nullable: true })
  hourlyCost!: number | null;

  @Column({ type: 'boolean', default: true })
  active!: boolean;

  @ManyToMany(() => SkillEntity)
  @JoinTable({
    name: 'staff_member_skills',
    joinColumn: { name: 'staffMemberId', referencedColumnName: 'id' },
    inverseJoinColumn: { name: 'skillId', referencedColumnName: 'id' },
  })
  skills!: SkillEntity[];
}
