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
import { UserEntity } from '../user.entity';

export type OneTimeTokenPurpose = 'invitation' | 'password-reset';

/** A single-use, expiring token sent by e-mail (invitation or password reset). Only its SHA-256 hash is stored. */
@Entity('one_time_tokens')
@Check('CHK_one_time_tokens_purpose', `"purpose" IN ('invitation', 'password-reset')`)
export class OneTimeTokenEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Index('IDX_one_time_tokens_user')
  @Column({ type: 'varchar' })
  userId!: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'userId' })
  user?: UserEntity;

  @Column({ type: 'varchar', length: 20 })
  purpose!: OneTimeTokenPurpose;

  @Column({ type: 'varchar', length: 64, unique: true })
  tokenHash!: string;

  @Column({ type: 'datetime' })
  expiresAt!: Date;

  /** Set when used, or when superseded by a newer token of the same purpose. */
  @Column({ type: 'datetime', nullable: true })
  usedAt!: Date | null;

  @CreateDateColumn({ type: 'datetime' })
  createdAt!: Date;
}
