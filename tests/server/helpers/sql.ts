import type { DataSource } from 'typeorm';

/**
 * Runs hand-written SQL on either engine: `?` placeholders become the driver's own (`$1`… on
 * PostgreSQL). Quote camelCase columns ("teamId"): PostgreSQL folds bare names to lower case.
 */
export function sql<T = Record<string, unknown>>(
  ds: DataSource,
  text: string,
  params: unknown[] = [],
): Promise<T[]> {
  let i = 0;
  const portable = text.replace(/\?/g, () => ds.driver.createParameter(`p${i}`, i++));
  return ds.query(portable, params) as Promise<T[]>;
}

/** Puts a user in a team with a role directly, as an accepted invitation would. */
export async function addMember(ds: DataSource, teamId: string, userId: string, role: string) {
  await sql(
    ds,
    'INSERT INTO memberships ("teamId", "userId", role, "joinedAt") VALUES (?, ?, ?, ?)',
    [teamId, userId, role, Date.now()],
  );
}
