import type { MigrationInterface, QueryRunner } from 'typeorm';

/** PostgreSQL twin of the SQLite migration of the same name (the time is bigint here). */
export class InviteWithdrawal1764720000000 implements MigrationInterface {
  name = 'InviteWithdrawal1764720000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE "invites" ADD COLUMN "withdrawnAt" bigint');
    await q.query('ALTER TABLE "invites" ADD COLUMN "withdrawnById" text');
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE "invites" DROP COLUMN "withdrawnById"');
    await q.query('ALTER TABLE "invites" DROP COLUMN "withdrawnAt"');
  }
}
