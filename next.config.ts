import type { NextConfig } from "next";
import { PHASE_DEVELOPMENT_SERVER } from "next/constants";
import { securityHeaders } from "./lib/security-headers";

export default function config(phase: string): NextConfig {
  return {
    // PGlite ships wasm and data files; bundling would copy them into the public static folder.
    serverExternalPackages: ["@electric-sql/pglite", "s3rver", "smtp-server", "mailparser"],
    poweredByHeader: false,
    // forbidden() and unauthorized() render 403 and 401 pages with the right status.
    experimental: { authInterrupts: true },
    headers: async () => securityHeaders(phase === PHASE_DEVELOPMENT_SERVER),
  };
}
