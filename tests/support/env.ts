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
