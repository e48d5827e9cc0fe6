import { Column, Entity, Index, PrimaryColumn } from 'typeorm';

@Entity('users')
export class User {
  @PrimaryColumn('text') id!: string;
  @Index({ unique: true })
  @Column('text')
  email!: string;
  @Column('text') name!: string;
  /** PHC string from argon2id; never leaves the server. */
  @Column('text') passwordHash!: string;
  /** Mail me about comments on my flights and replies to my comments. */
  @Column('boolean', { default: true }) commentMail!: boolean;
  /** Unix ms. */
  @Column('integer') createdAt!: number;
}
