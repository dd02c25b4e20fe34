import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** A message received by the built-in mail catcher. */
@Entity('mail_messages')
export class MailMessageEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar', nullable: true })
  messageId!: string | null;

  @Column({ type: 'varchar', length: 500 })
  from!: string;

  /** Envelope recipients as a JSON array of addresses. */
  @Column({ type: 'simple-json' })
  to!: string[];

  @Column({ type: 'varchar', length: 1000 })
  subject!: string;

  @Column({ type: 'text' })
  text!: string;

  @Column({ type: 'text', nullable: true })
  html!: string | null;

  @Index('IDX_mail_messages_received')
  @Column({ type: 'datetime' })
  receivedAt!: Date;
}
