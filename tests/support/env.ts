import { resetEnvForTests } from "@/lib/env";

/** Sets (or, with undefined, removes) variables for a test and re-reads the settings; returns the undo. */
export function setEnv(vars: Record<string, string | undefined>): () => void {
  const before = Object.fromEntries(Object.keys(vars).map((name) => [name, process.env[name]]));
  const apply = (values: Record<string, string | undefined>) => {
    for (const [name, value] of Object.entries(values)) {
      if (value === undefined) delete process.env[name];
      else process.env[name] = value;
    }
    resetEnvForTests();
  };
  apply(vars);
  return () => apply(before);
}

/** Every setting a production start needs, with invented values (lib/env.ts productionProblems). */
export const PRODUCTION_SETTINGS = {
  NODE_ENV: "production",
  BETTER_AUTH_SECRET: "s".repeat(32),
  BETTER_AUTH_URL: "https://ratecourt.example.org",
  LEDGER_KEY: "k".repeat(32),
  SMTP_URL: "smtp://mail.example.org:25",
  MAIL_FROM: "rc@example.org",
  S3_ENDPOINT: "https://objects.example.org",
  S3_BUCKET: "ratecourt",
  S3_ACCESS_KEY_ID: "key",
  S3_SECRET_ACCESS_KEY: "secret",
} as const;

/** The variables a production start refuses to go without, in the order it names them. */
export const PRODUCTION_VARIABLES = Object.keys(PRODUCTION_SETTINGS).filter((name) => name !== "NODE_ENV");
