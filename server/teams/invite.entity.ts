import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { Team } from './team.entity';

/** An invitation link; only the SHA-256 of its token is stored. */
@Entity('invites')
export class Invite {
  @PrimaryColumn('text') id!: string;
  @Index()
  @Column('text')
  teamId!: string;
  @ManyToOne(() => Team, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'teamId' })
  team?: Team;
  @Column('text') email!: string;
  @Column('text') role!: string;
  @Index({ unique: true })
  @Column('text')
  tokenHash!: string;
  @Column('text') invitedById!: string;
  /** Unix ms. */
  @Column('integer') expiresAt!: number;
  @Column('integer', { nullable: true }) acceptedAt!: number | null;
  @Column('text', { nullable: true }) acceptedById!: string | null;
  /** Unix ms; set when the owner withdraws the invitation before anyone accepts it. */
  @Column('integer', { nullable: true }) withdrawnAt!: number | null;
  @Column('text', { nullable: true }) withdrawnById!: string | null;
  @Column('integer') createdAt!: number;
}
