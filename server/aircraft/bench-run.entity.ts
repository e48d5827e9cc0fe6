import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { BenchRow } from '../../shared/schemas/aircraft';
import { User } from '../auth/user.entity';
import { Aircraft } from './aircraft.entity';

/** A thrust-stand table for one motor and prop. */
@Entity('bench_runs')
@Index('idx_bench_runs_aircraft_date', ['aircraftId', 'date'])
export class BenchRun {
  @PrimaryColumn('text') id!: string;
  @Column('text') aircraftId!: string;
  @ManyToOne(() => Aircraft, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'aircraftId' })
  aircraft?: Aircraft;
  @Column('text') date!: string;
  @Column('text') motor!: string;
  @Column('text') prop!: string;
  @Column('text', { default: '' }) note!: string;
  @Column('simple-json') rows!: BenchRow[];
  @Column('text') byId!: string;
  @ManyToOne(() => User)
  @JoinColumn({ name: 'byId' })
  by?: User;
  @Column('integer') createdAt!: number;
}
