import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { User } from './user.entity';

/** A lucia session; the id is what the cookie carries. */
@Entity('sessions')
export class Session {
  @PrimaryColumn('text') id!: string;
  @Index()
  @Column('text')
  userId!: string;
  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'userId' })
  user?: User;
  /** Unix seconds, as lucia's adapters store it. */
  @Column('integer') expiresAt!: number;
}
