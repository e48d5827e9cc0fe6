import type { MigrationInterface } from 'typeorm';
import { Initial1764633600000 } from './1764633600000-initial';
import { InviteWithdrawal1764720000000 } from './1764720000000-invite-withdrawal';
import { FlightListIndexes1764806400000 } from './1764806400000-flight-list-indexes';
import { Versions1764892800000 } from './1764892800000-versions';
import { DriftSamples1764979200000 } from './1764979200000-drift-samples';

/** Every migration in the order it must run. */
export const migrations: (new () => MigrationInterface)[] = [
  Initial1764633600000,
  InviteWithdrawal1764720000000,
  FlightListIndexes1764806400000,
  Versions1764892800000,
  DriftSamples1764979200000,
];
