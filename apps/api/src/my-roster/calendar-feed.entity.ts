import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
} from 'typeorm';
import { UserEntity } from '../users/user.entity';

/**
 * A user's iCalendar feed. The secret URL token is never stored: it is an HMAC of `nonce` under a key
 * derived from the server secret, so the API can show the URL again, while a copy of the database
 * alone does not reveal it. `tokenHash` (SHA-256 of the token) finds the feed of a request.
 * Regenerating draws a new nonce: the old URL then finds nothing (404).
 */
@Entity('calendar_feeds')
export class CalendarFeedEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Index('UQ_calendar_feeds_user', { unique: true })
  @Column({ type: 'varchar' })
  userId!: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'userId' })
  user?: UserEntity;

  @Column({ type: 'varchar', length: 64 })
  nonce!: string;

  @Index('UQ_calendar_feeds_token_hash', { unique: true })
  @Column({ type: 'varchar', length: 64 })
  tokenHash!: string;

  @CreateDateColumn({ type: 'datetime' })
  createdAt!: Date;
}

/**
 * What a user's feed last said about one event (one UID): its sequence number, a hash of its content
 * and whether it was cancelled, plus the content itself so a removed shift can still be sent as
 * STATUS:CANCELLED with its old times. Brought up to date lazily, whenever the feed is read (see
 * CalendarFeedService.sync), so changes made by other modules (swaps, repairs, edits) need no hook.
 */
@Entity('calendar_feed_events')
@Index('UQ_calendar_feed_events_user_uid', ['userId', 'uid'], { unique: true })
export class CalendarFeedEventEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  userId!: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'userId' })
  user?: UserEntity;

  /** Derived from staff member and date (one shift per person and day), never from assignment ids. */
  @Column({ type: 'varchar', length: 200 })
  uid!: string;

  @Column({ type: 'integer', default: 0 })
  sequence!: number;

  /** SHA-256 hex of the event's content as last sent. */
  @Column({ type: 'varchar', length: 64 })
  contentHash!: string;

  @Column({ type: 'boolean', default: false })
  cancelled!: boolean;

  /** The event as last sent (JSON of FeedEventContent). */
  @Column({ type: 'text' })
  content!: string;

  @CreateDateColumn({ type: 'datetime' })
  createdAt!: Date;

  /** When the content, the sequence or the cancellation last changed (DTSTAMP and LAST-MODIFIED). */
  @Column({ type: 'datetime' })
  changedAt!: Date;
}
