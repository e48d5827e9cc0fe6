/**
 * Primary or unique key violation, as SQLite and PostgreSQL report it. Two requests racing to
 * create the same thing end here; the error handler answers 409 for any that reaches it.
 */
export function isDuplicateKey(err: unknown): boolean {
  const driver = (err as { driverError?: { code?: string } }).driverError;
  const code = driver?.code ?? (err as { code?: string }).code;
  return (
    code === 'SQLITE_CONSTRAINT_PRIMARYKEY' ||
    code === 'SQLITE_CONSTRAINT_UNIQUE' ||
    code === '23505'
  );
}
