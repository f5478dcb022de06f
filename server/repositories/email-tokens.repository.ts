import { and, eq, gt, isNull } from 'drizzle-orm';
import type { Database } from '../db/client';
import { emailTokens, EMAIL_TOKEN_KINDS } from '../db/schema';

type Kind = (typeof EMAIL_TOKEN_KINDS)[number];

/** Stores a token hash for a user; earlier unused tokens of the same kind stop working. */
export async function issueEmailToken(
  db: Database,
  row: { userId: number; kind: Kind; tokenHash: string; expiresAt: Date; newEmail?: string | null },
): Promise<void> {
  await db.transaction(async (tx) => {
    await tx
      .update(emailTokens)
      .set({ usedAt: new Date() })
      .where(
        and(
          eq(emailTokens.userId, row.userId),
          eq(emailTokens.kind, row.kind),
          isNull(emailTokens.usedAt),
        ),
      );
    await tx.insert(emailTokens).values(row);
  });
}

/**
 * Marks a live token of this kind as used and returns it; undefined when it is unknown,
 * expired or already used. The conditional UPDATE makes a second use fail even when two
 * requests race.
 */
export async function consumeEmailToken(db: Database, kind: Kind, tokenHash: string) {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select()
      .from(emailTokens)
      .where(
        and(
          eq(emailTokens.tokenHash, tokenHash),
          eq(emailTokens.kind, kind),
          isNull(emailTokens.usedAt),
          gt(emailTokens.expiresAt, new Date()),
        ),
      )
      .for('update')
      .limit(1);
    if (!row) return undefined;
    await tx.update(emailTokens).set({ usedAt: new Date() }).where(eq(emailTokens.id, row.id));
    return row;
  });
}

/** A live (unused, unexpired) token of this kind, without using it up. */
export async function findLiveEmailToken(db: Database, kind: Kind, tokenHash: string) {
  const [row] = await db
    .select()
    .from(emailTokens)
    .where(
      and(
        eq(emailTokens.tokenHash, tokenHash),
        eq(emailTokens.kind, kind),
        isNull(emailTokens.usedAt),
        gt(emailTokens.expiresAt, new Date()),
      ),
    )
    .limit(1);
  return row;
}
