import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { UserEntity } from '../users/user.entity';

/** A cell of a published roster as it was sent to staff. */
export interface PublishedCell {
  staffMemberId: string;
  date: string;
  shiftTypeId: string;
}

/**
 * A snapshot of a period's roster at publish (and after each repair): the worked cells only, the
 * reference a repair measures its changes against.
 */
@Entity('roster_publications')
@Index('IDX_roster_publications_period_at', ['rosterPeriodId', 'publishedAt'])
export class RosterPublicationEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar' })
  rosterPeriodId!: string;

  @ManyToOne(() => RosterPeriodEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'rosterPeriodId' })
  rosterPeriod?: RosterPeriodEntity;

  @Column({ type: 'varchar', length: 16 })
  kind!: 'publish' | 'repair';

  @Column({ type: 'datetime' })
  publishedAt!: Date;

  @Column({ type: 'varchar', nullable: true })
  publishedById!: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'publishedById' })
  publishedBy?: UserEntity | null;

  @Column({ type: 'simple-json' })
  cells!: PublishedCell[];
}
