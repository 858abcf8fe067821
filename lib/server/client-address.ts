import "server-only";
import { env } from "@/lib/env";

/** What the sign-in throttle and the session records use when no trusted hop names the client. */
export const UNKNOWN_ADDRESS = "unknown";

/**
 * The client's address, for throttling. Next.js passes a client's own X-Forwarded-For through
 * unchanged (it fills the header from the socket only when it is absent), so the header names the
 * client only when TRUST_PROXY_HOPS proxies each append to it: then the address the outermost
 * proxy saw is the hops-th entry from the right, and anything left of it is the client's own
 * claim. Without a configured proxy every client counts as one unknown address.
 */
export function clientAddress(headers: Headers): string {
  const hops = env().TRUST_PROXY_HOPS;
  if (hops === 0) return UNKNOWN_ADDRESS;
  const chain = (headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map((part) => part.trim())
    .filter(Boolean);
  const address = chain[chain.length - hops];
  return address && /^[0-9a-fA-F:.]{2,45}$/.test(address) ? address.toLowerCase() : UNKNOWN_ADDRESS;
}
