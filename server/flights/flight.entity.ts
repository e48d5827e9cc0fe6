import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { User } from '../auth/user.entity';
import { Aircraft } from '../aircraft/aircraft.entity';
import { Team } from '../teams/team.entity';

/**
 * One flight log and its analysis summary. The id is the client's UUID. The columns are what
 * lists filter and sort on; the report and review detail JSON live in `flight_payloads`, so a
 * list never reads (or walks the overflow pages of) megabytes of traces.
 */
@Entity('flights')
// The team's flight list, newest first, with the id as tie-breaker for the cursor; one index per
// list filter, each ending in the list order (see the flight-list-indexes migration).
@Index('idx_flights_team_recorded', ['teamId', 'recordedAt', 'id'])
@Index('idx_flights_team_aircraft_recorded', ['teamId', 'aircraftId', 'recordedAt', 'id'])
@Index('idx_flights_team_pilot_recorded', ['teamId', 'pilotId', 'recordedAt', 'id'])
@Index('idx_flights_team_review_recorded', ['teamId', 'reviewState', 'recordedAt', 'id'])
@Index('idx_flights_team_open_recorded', ['teamId', 'recordedAt', 'id'], {
  where: '"openComments" > 0',
})
@Index('idx_flights_team_watch_recorded', ['teamId', 'recordedAt', 'id'], {
  where: '"worstSeverity" >= 2',
})
@Index('idx_flights_team_act_recorded', ['teamId', 'recordedAt', 'id'], {
  where: '"worstSeverity" >= 3',
})
// Trends and an aircraft's last flight.
@Index('idx_flights_aircraft_recorded', ['aircraftId', 'recordedAt', 'id'])
@Index('idx_flights_team_sha256', ['teamId', 'sha256'])
export class Flight {
  @PrimaryColumn('text') id!: string;
  @Column('text') teamId!: string;
  @ManyToOne(() => Team, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'teamId' })
  team?: Team;
  @Column('text') aircraftId!: string;
  @ManyToOne(() => Aircraft, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'aircraftId' })
  aircraft?: Aircraft;
  /** Who uploaded it. */
  @Column('text') pilotId!: string;
  @ManyToOne(() => User)
  @JoinColumn({ name: 'pilotId' })
  pilot?: User;
  /** Unix ms. */
  @Column('integer') recordedAt!: number;
  @Column('real') durationS!: number;
  @Column('real') sampleRateHz!: number;
  @Column('text') fileName!: string;
  @Column('text') sha256!: string;
  @Column('integer', { nullable: true }) sizeBytes!: number | null;
  /** Storage key of the raw log, once uploaded. */
  @Column('text', { nullable: true }) rawKey!: string | null;
  @Column('boolean', { default: false }) rawGzip!: boolean;
  @Column('integer') reportVersion!: number;
  /** TrendPoint fields extracted from the report, so trends never parse whole reports. */
  @Column('text') trend!: string;
  /** 0 none, 1 note, 2 watch, 3 act. */
  @Column('integer') worstSeverity!: number;
  @Column('integer') noteCount!: number;
  @Column('integer') watchCount!: number;
  @Column('integer') actCount!: number;
  @Column('integer', { default: 0 }) commentCount!: number;
  /** Unresolved root comments. */
  @Column('integer', { default: 0 }) openComments!: number;
  @Column('text', { default: 'none' }) reviewState!: string;
  @Column('text', { default: '' }) note!: string;
  @Column('integer') createdAt!: number;
  @Column('integer') updatedAt!: number;
}
