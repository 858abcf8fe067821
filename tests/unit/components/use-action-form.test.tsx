// @vitest-environment happy-dom
import { act } from "react";
import { createRoot, type Root } from "react-dom/client";
import { afterEach, describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { FormStatus } from "@/app/_components/form-status";
import { useActionForm, type ActionFormOptions } from "@/app/_components/use-action-form";
import type { FormResult } from "@/lib/server/form-action";

(globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean }).IS_REACT_ACT_ENVIRONMENT = true;

const schema = z.object({
  title: z.string().trim().min(3, "Write a title of at least 3 characters."),
  units: z.string().transform((s, ctx) => {
    const n = Number(s);
    if (!Number.isInteger(n) || n < 1) ctx.addIssue({ code: "custom", message: "A whole number of units." });
    return n;
  }),
});
type Input = z.input<typeof schema>;
type Output = z.output<typeof schema>;

function Probe(options: Omit<ActionFormOptions<Input, Output>, "schema" | "defaultValues">) {
  const { register, formState, submit, result, pending, dialog } = useActionForm<Input, Output>({
    schema,
    defaultValues: { title: "", units: "1" },
    ...options,
  });
  return (
    <form onSubmit={submit} aria-label="Probe" noValidate>
      <input id="title" {...register("title")} />
      <p id="title-error">{formState.errors.title?.message}</p>
      <input id="units" {...register("units")} />
      <p id="units-error">{formState.errors.units?.message}</p>
      <FormStatus result={result} />
      <button type="submit" disabled={pending}>
        {pending ? "Sending…" : "Send"}
      </button>
      {dialog}
    </form>
  );
}

let root: Root | null = null;
afterEach(() => {
  act(() => root?.unmount());
  root = null;
  document.body.innerHTML = "";
});

async function mount(props: Parameters<typeof Probe>[0]) {
  const host = document.createElement("div");
  document.body.append(host);
  root = createRoot(host);
  await act(async () => root!.render(<Probe {...props} />));
  const $ = <T extends Element = HTMLElement>(selector: string) => document.querySelector(selector) as T;
  return {
    $,
    async type(id: string, value: string) {
      const input = $<HTMLInputElement>(`#${id}`);
      await act(async () => {
        Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, "value")!.set!.call(input, value);
        input.dispatchEvent(new Event("input", { bubbles: true }));
      });
    },
    async submit() {
      await act(async () => {
        $("form").dispatchEvent(new Event("submit", { bubbles: true, cancelable: true }));
      });
    },
    button: () => $<HTMLButtonElement>("button[type=submit]"),
    status: () => $("[role=status], [role=alert]")?.textContent ?? null,
  };
}

function deferred() {
  let resolve!: (result: FormResult) => void;
  const promise = new Promise<FormResult>((r) => (resolve = r));
  return { promise, resolve };
}

describe("useActionForm", () => {
  it("sends nothing while the schema fails, and says so under the fields", async () => {
    const send = vi.fn(async () => ({ ok: true }));
    const form = await mount({ send });
    await form.type("title", "ab");
    await form.type("units", "1.5");
    await form.submit();
    expect(send).not.toHaveBeenCalled();
    expect(form.$("#title-error").textContent).toBe("Write a title of at least 3 characters.");
    expect(form.$("#units-error").textContent).toBe("A whole number of units.");
    expect(form.status()).toBeNull();
  });

  it("shows the invalid message as the status line when one is given", async () => {
    const send = vi.fn(async () => ({ ok: true }));
    const form = await mount({ send, invalidMessage: "Check the title." });
    await form.submit();
    expect(send).not.toHaveBeenCalled();
    expect(form.status()).toBe("Check the title.");
  });

  it("sends the schema's output, and disables the button while the action runs", async () => {
    const answer = deferred();
    const send = vi.fn(() => answer.promise);
    const form = await mount({ send });
    await form.type("title", "  Radios  ");
    await form.type("units", "12");
    await form.submit();
    expect(send).toHaveBeenCalledWith({ title: "Radios", units: 12 });
    expect(form.button().disabled).toBe(true);
    expect(form.button().textContent).toBe("Sending…");
    await act(async () => answer.resolve({ ok: true, message: "Saved." }));
    expect(form.button().disabled).toBe(false);
    expect(form.$("[role=status]").textContent).toBe("Saved.");
  });

  it("puts the server's field messages under the fields, like the schema's own", async () => {
    const send = vi.fn(async () => ({
      message: "Check the highlighted fields.",
      fieldErrors: { title: ["A tender with this title exists."], units: ["Too many."] },
    }));
    const form = await mount({ send });
    await form.type("title", "Radios");
    await form.submit();
    expect(form.$("[role=alert]").textContent).toBe("Check the highlighted fields.");
    expect(form.$("#title-error").textContent).toBe("A tender with this title exists.");
    expect(form.$("#units-error").textContent).toBe("Too many.");
    expect(form.$<HTMLInputElement>("#title").value).toBe("Radios");
  });

  it("resets the fields and calls onSuccess after a success, only when asked", async () => {
    const onSuccess = vi.fn();
    const kept = await mount({ send: async () => ({ ok: true, message: "Saved." }), onSuccess });
    await kept.type("title", "Radios");
    await kept.submit();
    expect(kept.$<HTMLInputElement>("#title").value).toBe("Radios");
    expect(onSuccess).toHaveBeenCalledTimes(1);
    act(() => root?.unmount());
    document.body.innerHTML = "";

    const emptied = await mount({ send: async () => ({ ok: true, message: "Saved." }), resetOnSuccess: true, onSuccess });
    await emptied.type("title", "Radios");
    await emptied.type("units", "7");
    await emptied.submit();
    expect(emptied.$<HTMLInputElement>("#title").value).toBe("");
    expect(emptied.$<HTMLInputElement>("#units").value).toBe("1");
    expect(emptied.status()).toBe("Saved.");
    expect(onSuccess).toHaveBeenCalledTimes(2);
  });

  it("keeps the fields and skips onSuccess when the server refuses", async () => {
    const onSuccess = vi.fn();
    const form = await mount({ send: async () => ({ message: "The tender is closed." }), resetOnSuccess: true, onSuccess });
    await form.type("title", "Radios");
    await form.submit();
    expect(form.$<HTMLInputElement>("#title").value).toBe("Radios");
    expect(form.status()).toBe("The tender is closed.");
    expect(onSuccess).not.toHaveBeenCalled();
  });

  it("asks before sending when a confirmation is given, and sends only on confirming", async () => {
    const send = vi.fn(async () => ({ ok: true, message: "Signed." }));
    const confirm = (values: { units: number }) =>
      values.units > 5 ? { title: "Order that many?", consequences: "This cannot be undone.", action: "Order" } : null;
    const form = await mount({ send, confirm });
    await form.type("title", "Radios");
    await form.submit();
    expect(send).toHaveBeenCalledTimes(1);

    await form.type("units", "9");
    await form.submit();
    expect(send).toHaveBeenCalledTimes(1);
    expect(form.$("#confirm-title").textContent).toBe("Order that many?");
    const button = (label: string) => [...document.querySelectorAll("dialog button")].find((b) => b.textContent === label) as HTMLButtonElement;
    await act(async () => button("Go back").click());
    expect(send).toHaveBeenCalledTimes(1);
    await form.submit();
    await act(async () => button("Order").click());
    expect(send).toHaveBeenCalledTimes(2);
    expect(send).toHaveBeenLastCalledWith({ title: "Radios", units: 9 });
  });
});
