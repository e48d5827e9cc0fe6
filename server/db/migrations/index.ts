import type { MigrationInterface } from 'typeorm';

/** Every migration in the order it must run. */
export const migrations: (new () => MigrationInterface)[] = [];
