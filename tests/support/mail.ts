import { flushMail, listCapturedMail, type CapturedMail } from "@/lib/mail";

/**
 * The captured mail whose subject names `reference`, once at least `atLeast` of them have arrived
 * (notices are queued after the local mail server starts, so they may trail the action).
 */
export async function mailAbout(reference: string, atLeast: number): Promise<CapturedMail[]> {
  for (let i = 0; i < 100; i++) {
    await flushMail();
    const found = listCapturedMail().filter((m) => m.subject.includes(reference));
    if (found.length >= atLeast) return found;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`fewer than ${atLeast} messages about ${reference}`);
}
