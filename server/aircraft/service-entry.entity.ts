import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { User } from '../auth/user.entity';
import { Aircraft } from './aircraft.entity';

/** A repair, part swap or inspection in an aircraft's service log. */
@Entity('service_entries')
@Index('idx_service_entries_aircraft_date', ['aircraftId', 'date'])
export class ServiceEntry {
  @PrimaryColumn('text') id!: string;
  @Column('text') aircraftId!: string;
  @ManyToOne(() => Aircraft, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'aircraftId' })
  aircraft?: Aircraft;
  /** YYYY-MM-DD. */
  @Column('text') date!: string;
  @Column('text') kind!: string;
  @Column('integer', { nullable: true }) motor!: number | null;
  @Column('text') note!: string;
  @Column('text') byId!: string;
  @ManyToOne(() => User)
  @JoinColumn({ name: 'byId' })
  by?: User;
  @Column('integer') createdAt!: number;
}
