import { Column, Entity, JoinColumn, OneToOne, PrimaryColumn } from 'typeorm';
import { Flight } from './flight.entity';

/** The large JSON of a flight, read only when one flight is opened. */
@Entity('flight_payloads')
export class FlightPayload {
  @PrimaryColumn('text') flightId!: string;
  @OneToOne(() => Flight, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'flightId' })
  flight?: Flight;
  /** FlightReport JSON, versioned by its own `version` (also in flights.reportVersion). */
  @Column('text') report!: string;
  /** ReviewDetail JSON (downsampled traces and spectra), optional. */
  @Column('text', { nullable: true }) detail!: string | null;
}
