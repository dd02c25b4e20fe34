import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { type ShiftColour } from '@rotaplex/contracts';
import { UnitEntity } from '../units/unit.entity';

/** A shift of a unit: wall-clock start and end in the unit's time zone (may cross midnight). */
@Entity('shift_types')
@Index('UQ_shift_types_unit_code', ['unitId', 'code'], { unique: true })
export class ShiftTypeEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  unitId!: string;

  @ManyToOne(() => UnitEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'unitId' })
  unit?: UnitEntity;

  @Column({ type: 'varchar', length: 4 })
  code!: string;

  @Column({ type: 'varchar', length: 200 })
  name!: string;

  /** "HH:mm" */
  @Column({ type: 'varchar', length: 5 })
  start!: string;

  /** "HH:mm"; not after start: the next day. */
  @Column({ type: 'varchar', length: 5 })
  end!: string;

  @Column({ type: 'integer' })
  paidMinutes!: number;

  @Column({ type: 'varchar', length: 16 })
  colour!: ShiftColour;

  /** null: derived from the times. */
  @Column({ type: 'boolean', nullable: true })
  night!: boolean | null;
}
