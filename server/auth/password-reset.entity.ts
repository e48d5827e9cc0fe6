import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { User } from './user.entity';

/** One-time password reset token; only its SHA-256 is stored. */
@Entity('password_resets')
export class PasswordReset {
  @PrimaryColumn('text') id!: string;
  @Index()
  @Column('text')
  userId!: string;
  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'userId' })
  user?: User;
  @Index({ unique: true })
  @Column('text')
  tokenHash!: string;
  /** Unix ms. */
  @Column('integer') expiresAt!: number;
  @Column('integer', { nullable: true }) usedAt!: number | null;
  @Column('integer') createdAt!: number;
}
