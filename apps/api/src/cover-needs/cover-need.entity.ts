import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { ShiftTypeEntity } from '../shift-types/shift-type.entity';
import { SkillEntity } from '../skills/skill.entity';
import { UnitEntity } from '../units/unit.entity';

/** One row of a unit's weekly cover pattern. weekday: 0 = Sunday … 6 = Saturday. */
@Entity('cover_pattern_rows')
@Index('IDX_cover_pattern_rows_unit', ['unitId'])
export class CoverPatternRowEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  unitId!: string;

  @ManyToOne(() => UnitEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'unitId' })
  unit?: UnitEntity;

  @Column({ type: 'integer' })
  weekday!: number;

  @Column({ type: 'varchar' })
  shiftTypeId!: string;

  @ManyToOne(() => ShiftTypeEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'shiftTypeId' })
  shiftType?: ShiftTypeEntity;

  @Column({ type: 'varchar', nullable: true })
  skillId!: string | null;

  @ManyToOne(() => SkillEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'skillId' })
  skill?: SkillEntity | null;

  @Column({ type: 'integer' })
  min!: number;

  @Column({ type: 'integer' })
  target!: number;
}

/** A need for one date, replacing the pattern's row with the same shift type and skill that day. */
@Entity('cover_overrides')
@Index('IDX_cover_overrides_unit_date', ['unitId', 'date'])
export class CoverOverrideEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  unitId!: string;

  @ManyToOne(() => UnitEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'unitId' })
  unit?: UnitEntity;

  /** "YYYY-MM-DD" */
  @Column({ type: 'varchar', length: 10 })
  date!: string;

  @Column({ type: 'varchar' })
  shiftTypeId!: string;

  @ManyToOne(() => ShiftTypeEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'shiftTypeId' })
  shiftType?: ShiftTypeEntity;

  @Column({ type: 'varchar', nullable: true })
  skillId!: string | null;

  @ManyToOne(() => SkillEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'skillId' })
  skill?: SkillEntity | null;

  @Column({ type: 'integer' })
  min!: number;

  @Column({ type: 'integer' })
  target!: number;
}
