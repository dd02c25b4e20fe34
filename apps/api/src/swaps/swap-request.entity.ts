import { SWAP_KINDS, SWAP_STATUSES, type SwapKind, type SwapStatus } from '@rotaplex/contracts';
import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
  VersionColumn,
} from 'typeorm';
import { RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { StaffMemberEntity } from '../staff/staff-member.entity';
import { UserEntity } from '../users/user.entity';

/** One cell a request changes, with the shift recorded at proposal (the optimistic lock). */
export interface StoredCellChange {
  staffMemberId: string;
  date: string;
  before: string | null;
  after: string | null;
}

const list = (values: readonly string[]) => values.map((v) => `'${v}'`).join(', ');

/**
 * A change to a published roster asked for by staff: a swap (A and B exchange shifts), an offer
 * (A gives a shift to B) or an open-shift claim. The colleague accepts (not for claims), then a
 * manager of the unit approves; approval applies `changes` only if every cell still holds its
 * `before` shift.
 */
@Entity('swap_requests')
@Check('CHK_swap_requests_kind', `"kind" IN (${list(SWAP_KINDS)})`)
@Check('CHK_swap_requests_status', `"status" IN (${list(SWAP_STATUSES)})`)
@Index('IDX_swap_requests_period_status', ['rosterPeriodId', 'status'])
@Index('IDX_swap_requests_status_first_date', ['status', 'firstDate'])
export class SwapRequestEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  rosterPeriodId!: string;

  @ManyToOne(() => RosterPeriodEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'rosterPeriodId' })
  rosterPeriod?: RosterPeriodEntity;

  // uuid: a varchar on SQLite, PostgreSQL's uuid there (compared with units.id).
  @Column({ type: 'uuid' })
  unitId!: string;

  @Column({ type: 'varchar', length: 8 })
  kind!: SwapKind;

  @Column({ type: 'varchar', length: 12 })
  status!: SwapStatus;

  @Column({ type: 'varchar' })
  proposerStaffMemberId!: string;

  @ManyToOne(() => StaffMemberEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'proposerStaffMemberId' })
  proposer?: StaffMemberEntity;

  @Column({ type: 'varchar', nullable: true })
  colleagueStaffMemberId!: string | null;

  @ManyToOne(() => StaffMemberEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'colleagueStaffMemberId' })
  colleague?: StaffMemberEntity | null;

  /** Open-shift claims: the skill of the need claimed (null: any). */
  @Column({ type: 'uuid', nullable: true })
  skillId!: string | null;

  /** JSON array of {@link StoredCellChange}. */
  @Column({ type: 'text' })
  changes!: string;

  /**
   * The earliest day `changes` touches (YYYY-MM-DD). A request still pending once that day has
   * passed in the unit's time zone expires (the scheduled sweep, and every decision, check it).
   */
  @Column({ type: 'varchar', length: 10 })
  firstDate!: string;

  @Column({ type: 'varchar', length: 500, nullable: true })
  note!: string | null;

  @Column({ type: 'varchar', length: 1000, nullable: true })
  outcome!: string | null;

  @Column({ type: 'varchar', nullable: true })
  decidedById!: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'decidedById' })
  decidedBy?: UserEntity | null;

  @CreateDateColumn({ type: 'datetime' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime' })
  updatedAt!: Date;

  @VersionColumn({ type: 'integer' })
  version!: number;
}

export const SWAP_LINK_ROLES = ['colleague', 'manager'] as const;
export type SwapLinkRole = (typeof SWAP_LINK_ROLES)[number];

/**
 * An e-mailed decision link: single use, expiring, for one decision step of one request by one
 * user. Only the SHA-256 hash of the token is stored.
 */
@Entity('swap_link_tokens')
@Check('CHK_swap_link_tokens_role', `"role" IN (${list(SWAP_LINK_ROLES)})`)
export class SwapLinkTokenEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Index('IDX_swap_link_tokens_request')
  @Column({ type: 'varchar' })
  swapRequestId!: string;

  @ManyToOne(() => SwapRequestEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'swapRequestId' })
  swapRequest?: SwapRequestEntity;

  @Column({ type: 'varchar' })
  userId!: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'userId' })
  user?: UserEntity;

  @Column({ type: 'varchar', length: 12 })
  role!: SwapLinkRole;

  @Column({ type: 'varchar', length: 64, unique: true })
  tokenHash!: string;

  @Column({ type: 'datetime' })
  expiresAt!: Date;

  /** Set when used, or when the step was decided another way (in the app, by another manager). */
  @Column({ type: 'datetime', nullable: true })
  usedAt!: Date | null;

  @CreateDateColumn({ type: 'datetime' })
  createdAt!: Date;
}
