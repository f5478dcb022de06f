import { sql } from 'drizzle-orm';
import type { Database } from '../db/client';

/** Deletes every stored session of a member except `keepSessionId`; resolves with the count. */
export async function deleteSessionsOfUser(
  db: Database,
  userId: number,
  keepSessionId?: string,
): Promise<number> {
  const [result] = await db.execute(
    sql`DELETE FROM sessions WHERE JSON_VALUE(data, '$.userId') = ${userId} AND session_id <> ${keepSessionId ?? ''}`,
  );
  return (result as unknown as { affectedRows: number }).affectedRows;
}
