import { Column, Entity, PrimaryColumn } from 'typeorm';

@Entity('teams')
export class Team {
  @PrimaryColumn('text') id!: string;
  @Column('text') name!: string;
  /** Analysis thresholds as validated JSON; null means the analysis defaults. */
  @Column('text', { nullable: true }) thresholds!: string | null;
  @Column('integer', { nullable: true }) thresholdsUpdatedAt!: number | null;
  @Column('integer') createdAt!: number;
  /** Adds one on every thresholds write; `If-Match` names it. */
  @Column('integer', { default: 1 }) thresholdsVersion!: number;
}
