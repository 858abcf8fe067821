/** The message under a field, tied to it by id for screen readers. */
export function FieldError({ id, message }: { id: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="mt-1 text-xs text-verdict-impossible">
      {message}
    </p>
  );
}

/** react-hook-form keeps nested errors as a tree; this reads one by its dotted path. */
export function errorAt(errors: unknown, path: string): string | undefined {
  let node: unknown = errors;
  for (const key of path.split(".")) node = (node as Record<string, unknown> | undefined)?.[key];
  const direct = (node as { message?: unknown } | undefined)?.message;
  if (typeof direct === "string") return direct;
  // An array or object refinement sits on its root.
  const root = (node as { root?: { message?: unknown } } | undefined)?.root?.message;
  return typeof root === "string" ? root : undefined;
}
