import "server-only";
import { lt, sql } from "drizzle-orm";
import { getDb } from "./database";
import { env } from "@/lib/env";
import { rateLimits } from "@/db/schema";

export interface RateRule {
  /** Seconds. */
  window: number;
  max: number;
}

/** Sign-in attempts per client address, on the auth endpoint and on the sign-in form alike. */
export const signInRate = (): RateRule => ({ window: 60, max: env().SIGN_IN_ATTEMPTS_PER_MINUTE });
/** Every other auth endpoint, per client address. */
export const AUTH_RATE: RateRule = { window: 60, max: 100 };

const DAY_MS = 24 * 60 * 60 * 1000;

/**
 * Counts one request against `key` in the database, so every server instance shares the count:
 * a fixed window per key, started by its first request. One statement, so concurrent requests
 * never both pass on a stale count. Past windows are pruned when a new one starts.
 */
export async function consumeRate(key: string, rule: RateRule, now = Date.now()): Promise<{ allowed: boolean; retryAfter: number | null }> {
  const db = await getDb();
  const expired = now - rule.window * 1000;
  const [row] = await db
    .insert(rateLimits)
    .values({ key, count: 1, windowStart: now })
    .onConflictDoUpdate({
      target: rateLimits.key,
      set: {
        count: sql`case when ${rateLimits.windowStart} <= ${expired} then 1 else ${rateLimits.count} + 1 end`,
        windowStart: sql`case when ${rateLimits.windowStart} <= ${expired} then ${now} else ${rateLimits.windowStart} end`,
      },
    })
    .returning();
  if (row.count === 1) await db.delete(rateLimits).where(lt(rateLimits.windowStart, now - DAY_MS));
  if (row.count <= rule.max) return { allowed: true, retryAfter: null };
  return { allowed: false, retryAfter: Math.max(1, Math.ceil((row.windowStart + rule.window * 1000 - now) / 1000)) };
}
