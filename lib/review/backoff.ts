/** Most send attempts before a message is marked failed for good. */
export const MAX_SEND_ATTEMPTS = 8;

/**
 * Delay before the next send attempt after `attempts` failures: doubling from `baseMs`, capped
 * at `maxMs` (exponential back-off, common practice for retrying a remote service).
 */
export function retryDelayMs(attempts: number, baseMs: number, maxMs = 15 * 60_000): number {
  if (attempts < 1) return 0;
  return Math.min(maxMs, baseMs * 2 ** (attempts - 1));
}
