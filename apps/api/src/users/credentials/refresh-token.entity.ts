import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
} from 'typeorm';
import { UserEntity } from '../user.entity';

/**
 * One refresh token of a rotation family. Only the SHA-256 hash of the token is stored. Using a
 * token replaces it with a new one of the same family; presenting a replaced token again means it
 * was stolen, and the whole family is revoked (OAuth 2.0 Security BCP, RFC 9700 §4.14.2).
 */
@Entity('refresh_tokens')
export class RefreshTokenEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Index('IDX_refresh_tokens_user')
  @Column({ type: 'varchar' })
  userId!: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'userId' })
  user?: UserEntity;

  @Index('IDX_refresh_tokens_family')
  @Column({ type: 'varchar' })
  familyId!: string;

  @Column({ type: 'varchar', length: 64, unique: true })
  tokenHash!: string;

  @Column({ type: 'datetime' })
  expiresAt!: Date;

  /** Set when the token was exchanged for its successor. */
  @Column({ type: 'datetime', nullable: true })
  replacedAt!: Date | null;

  /** Set when the family was revoked (logout, reuse, deactivation, password change). */
  @Column({ type: 'datetime', nullable: true })
  revokedAt!: Date | null;

  @CreateDateColumn({ type: 'datetime' })
  createdAt!: Date;
}
