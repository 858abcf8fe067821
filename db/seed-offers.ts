import type { Queryable } from "./client";
import type { DemoContext } from "./seed";

/** The demo offers: four vendors on the gauges tender (one claim beyond capacity, one needing evidence, two honest). */
export async function seedDemoOffers(_tx: Queryable, _ctx: DemoContext): Promise<void> {}
