import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { User } from '../auth/user.entity';
import { Flight } from '../flights/flight.entity';

/** A comment pinned to a moment of a flight; the id is the client's UUID. */
@Entity('comments')
@Index('idx_comments_flight_t', ['flightId', 'tS'])
export class Comment {
  @PrimaryColumn('text') id!: string;
  @Column('text') flightId!: string;
  @ManyToOne(() => Flight, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'flightId' })
  flight?: Flight;
  @Column('text') authorId!: string;
  @ManyToOne(() => User)
  @JoinColumn({ name: 'authorId' })
  author?: User;
  @Index()
  @Column('text', { nullable: true })
  parentId!: string | null;
  @ManyToOne(() => Comment, { onDelete: 'CASCADE', nullable: true })
  @JoinColumn({ name: 'parentId' })
  parent?: Comment | null;
  /** Seconds into the flight. */
  @Column('real') tS!: number;
  @Column('text', { nullable: true }) channel!: string | null;
  @Column('text') body!: string;
  /** User ids mentioned. */
  @Column('simple-json') mentions!: string[];
  @Column('integer', { nullable: true }) resolvedAt!: number | null;
  @Column('text', { nullable: true }) resolvedById!: string | null;
  @Column('integer', { nullable: true }) editedAt!: number | null;
  @Column('integer', { nullable: true }) deletedAt!: number | null;
  @Column('integer') createdAt!: number;
  /** Adds one on every write; `If-Match` names it. */
  @Column('integer', { default: 1 }) version!: number;
}
