import type { MigrationInterface } from 'typeorm';
import { Initial1764633600000 } from './1764633600000-initial';

/** Every migration in the order it must run. */
export const migrations: (new () => MigrationInterface)[] = [Initial1764633600000];
