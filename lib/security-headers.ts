// The response headers every answer carries, read by next.config.ts. Pure: no settings, no I/O.

type Header = { key: string; value: string };
export type HeaderRule = { source: string; headers: Header[] };

/**
 * The pages' content security policy. Next.js writes its hydration data as inline scripts and AG Grid
 * and the charts set inline styles, so both allow 'unsafe-inline' (without nonces, which would make
 * every page dynamic); everything else comes from the app itself. The development server also needs
 * eval (React's debugging) and its reload socket.
 */
export function contentSecurityPolicy(dev: boolean): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'unsafe-inline'${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    `connect-src 'self'${dev ? " ws: wss:" : ""}`,
    "frame-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

export function securityHeaders(dev: boolean): HeaderRule[] {
  return [
    {
      source: "/:path*",
      headers: [
        { key: "X-Content-Type-Options", value: "nosniff" },
        { key: "Referrer-Policy", value: "same-origin" },
        { key: "X-Frame-Options", value: "DENY" },
        { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=()" },
      ],
    },
    // Pages get the full policy; API answers (JSON, PDFs) only refuse to be framed elsewhere.
    { source: "/((?!api/).*)", headers: [{ key: "Content-Security-Policy", value: contentSecurityPolicy(dev) }] },
    { source: "/api/:path*", headers: [{ key: "Content-Security-Policy", value: "frame-ancestors 'none'" }] },
    // The Sign-off page shows the memo preview in a frame of its own.
    {
      source: "/api/v1/tenders/:id/memo/preview",
      headers: [
        { key: "Content-Security-Policy", value: "frame-ancestors 'self'" },
        { key: "X-Frame-Options", value: "SAMEORIGIN" },
      ],
    },
  ];
}
