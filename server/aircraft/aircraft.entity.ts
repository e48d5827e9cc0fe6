import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { Components } from '../../shared/schemas/aircraft';
import type { Airframe } from '../../shared/schemas/airframe';
import { Team } from '../teams/team.entity';

@Entity('aircraft')
export class Aircraft {
  @PrimaryColumn('text') id!: string;
  @Index()
  @Column('text')
  teamId!: string;
  @ManyToOne(() => Team, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'teamId' })
  team?: Team;
  @Column('text') name!: string;
  @Column('simple-json') airframe!: Airframe;
  @Column('simple-json') components!: Components;
  @Column('text', { default: '' }) notes!: string;
  @Column('integer') createdAt!: number;
  @Column('integer') updatedAt!: number;
  /** Adds one on every write; `If-Match` names it. */
  @Column('integer', { default: 1 }) version!: number;
}
