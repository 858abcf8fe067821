import type { Queryable } from "./client";
import type { DemoContext } from "./seed";

/** The demo review: the lab run on the claim that needs evidence. */
export async function seedDemoReview(_tx: Queryable, _ctx: DemoContext): Promise<void> {}
