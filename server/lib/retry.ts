const RETRYABLE = new Set(['ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT']);

/** True for errors after which InnoDB has rolled the statement or transaction back. */
export function isRetryableLockError(error: unknown): boolean {
  const code =
    (error as { code?: string } | null)?.code ??
    (error as { cause?: { code?: string } } | null)?.cause?.code;
  return typeof code === 'string' && RETRYABLE.has(code);
}

/**
 * Runs a whole transaction (or idempotent statement) again when InnoDB chose it as a
 * deadlock victim, with a short random back-off; MariaDB's own advice for error 1213. Only
 * for work that is safe to repeat: the failed attempt was rolled back in full.
 */
export async function retryOnDeadlock<T>(work: () => Promise<T>, attempts = 5): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await work();
    } catch (error) {
      if (attempt >= attempts || !isRetryableLockError(error)) throw error;
      await new Promise((resolve) => setTimeout(resolve, 5 + Math.random() * 20 * attempt));
    }
  }
}
