import type { FormResult } from "@/lib/server/form-action";

/** The outcome line under a form: a status when it worked, an alert when it did not. */
export function FormStatus({ result }: { result: FormResult }) {
  if (!result.message) return null;
  return (
    <p role={result.ok ? "status" : "alert"} className={`text-sm ${result.ok ? "text-verdict-plausible" : "text-verdict-impossible"}`}>
      {result.message}
    </p>
  );
}

export function FieldError({ message }: { message?: string }) {
  return message ? <p className="mt-1 text-xs text-verdict-impossible">{message}</p> : null;
}
