import type { MigrationInterface } from 'typeorm';
import { FlightListIndexes1764806400000 } from '../migrations/1764806400000-flight-list-indexes';
import { Initial1764633600000 } from './1764633600000-initial';
import { InviteWithdrawal1764720000000 } from './1764720000000-invite-withdrawal';
import { Versions1764892800000 } from './1764892800000-versions';
import { DriftSamples1764979200000 } from './1764979200000-drift-samples';

/**
 * Every PostgreSQL migration in the order it must run. Each has the name of its SQLite twin in
 * `../migrations`, so both engines record the same history; where the SQLite SQL is portable
 * (indexes) the twin is the SQLite class itself. A new SQLite migration needs its entry here.
 */
export const postgresMigrations: (new () => MigrationInterface)[] = [
  Initial1764633600000,
  InviteWithdrawal1764720000000,
  FlightListIndexes1764806400000,
  Versions1764892800000,
  DriftSamples1764979200000,
];
