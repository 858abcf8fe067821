import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // PGlite ships wasm and data files; bundling would copy them into the public static folder.
  serverExternalPackages: ["@electric-sql/pglite", "s3rver", "smtp-server", "mailparser"],
  poweredByHeader: false,
  // forbidden() and unauthorized() render 403 and 401 pages with the right status.
  experimental: { authInterrupts: true },
};

export default nextConfig;
