import type { MigrationInterface, QueryRunner } from 'typeorm';

/** An owner may withdraw an invitation; the row stays so its link can say so. */
export class InviteWithdrawal1764720000000 implements MigrationInterface {
  name = 'InviteWithdrawal1764720000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE "invites" ADD COLUMN "withdrawnAt" integer');
    await q.query('ALTER TABLE "invites" ADD COLUMN "withdrawnById" text');
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE "invites" DROP COLUMN "withdrawnById"');
    await q.query('ALTER TABLE "invites" DROP COLUMN "withdrawnAt"');
  }
}
