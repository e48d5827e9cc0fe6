import type { ObjectLiteral, SelectQueryBuilder } from 'typeorm';
import { User } from '../auth/user.entity';

/**
 * Runs a query of entities, each paired with the name of the user its `userIdColumn` points to
 * (who logged a service entry, who sent an invite). The join finds one user per row, so the raw
 * rows and the entities line up one to one.
 */
export async function withUserNames<T extends ObjectLiteral>(
  query: SelectQueryBuilder<T>,
  userIdColumn: string,
): Promise<[T, string][]> {
  const rows = await query
    .innerJoin(User, 'named_user', `named_user.id = ${userIdColumn}`)
    .addSelect('named_user.name', 'userName')
    .getRawAndEntities();
  return rows.entities.map((e, k) => [e, String((rows.raw[k] as { userName: string }).userName)]);
}
