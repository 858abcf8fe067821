// The demo's local fakes come from development packages (devDependencies): an install without
// them (`npm ci --omit=dev`) can run production, and says so plainly when asked for the demo.
import type { Env } from "../env";

type Services = Pick<Env, "demoMode" | "SMTP_URL" | "S3_ENDPOINT">;

/** The packages that the fakes this start would run need (none where a real service is named). */
export function demoPackages(settings: Services): string[] {
  if (!settings.demoMode) return [];
  return [...(settings.SMTP_URL ? [] : ["smtp-server", "mailparser"]), ...(settings.S3_ENDPOINT ? [] : ["s3rver", "@smithy/signature-v4"])];
}

/** Those of demoPackages(settings) that `resolve` cannot find. */
export function missingDemoPackages(settings: Services, resolve: (name: string) => unknown): string[] {
  return demoPackages(settings).filter((name) => {
    try {
      resolve(name);
      return false;
    } catch {
      return true;
    }
  });
}

/** `missing`: the packages known to be absent; `needed`: those the fakes use, when which one failed is unknown. */
export function demoPackagesRefusal(packages: { missing: string[] } | { needed: string[] }): string {
  const which = "missing" in packages ? `missing: ${packages.missing.join(", ")}` : `it uses ${packages.needed.join(", ")}`;
  return [
    `Ratecourt cannot start in demo mode: demo mode needs the development packages: run npm install (${which}).`,
    "A production start (without DEMO=1, with its own mail and storage settings) does not need them.",
  ].join("\n");
}

/** Whether an import failed because a package is not installed. */
export function isMissingPackage(error: unknown): boolean {
  const { code, message } = (error ?? {}) as { code?: unknown; message?: unknown };
  return code === "ERR_MODULE_NOT_FOUND" || code === "MODULE_NOT_FOUND" || /Cannot find (module|package)/.test(String(message));
}
