import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { User } from '../auth/user.entity';
import { Team } from './team.entity';

/** A user's role in one team; a user may hold several, one per team. */
@Entity('memberships')
@Index('idx_memberships_user', ['userId'])
export class Membership {
  @PrimaryColumn('text') teamId!: string;
  @PrimaryColumn('text') userId!: string;
  @ManyToOne(() => Team, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'teamId' })
  team?: Team;
  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'userId' })
  user?: User;
  @Column('text') role!: string;
  @Column('integer') joinedAt!: number;
}
