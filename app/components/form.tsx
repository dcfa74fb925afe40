import { useId, useState, type FormEvent } from "react";
import type { z } from "zod";
import { fieldErrorsOf, type FieldErrors } from "~/utils/forms";

export type { FieldErrors };

/**
 * Checks a form with the same zod schema the server uses, before it is sent. Errors from the server
 * (returned by the action) show until the next submit.
 */
export function useZodForm(
  schema: z.ZodType,
  serverErrors?: FieldErrors | null,
) {
  const [clientErrors, setClientErrors] = useState<FieldErrors | null>(null);
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    const form = event.currentTarget;
    const formData = new FormData(form);
    const submitter = (event.nativeEvent as SubmitEvent).submitter;
    if (submitter instanceof HTMLButtonElement && submitter.name)
      formData.set(submitter.name, submitter.value);
    const result = schema.safeParse(Object.fromEntries(formData));
    if (result.success) {
      setClientErrors(null);
      return;
    }
    event.preventDefault();
    const errors = fieldErrorsOf(result.error.issues);
    setClientErrors(errors);
    const first = form.querySelector<HTMLElement>(
      `[name="${Object.keys(errors)[0]}"]`,
    );
    first?.focus();
  };
  return { errors: clientErrors ?? serverErrors ?? {}, onSubmit };
}

export function TextField({
  label,
  name,
  errors,
  hint,
  className = "",
  ...input
}: {
  label: string;
  name: string;
  errors?: string[];
  hint?: string;
} & React.InputHTMLAttributes<HTMLInputElement>) {
  const id = useId();
  const errorId = `${id}-error`;
  const hintId = `${id}-hint`;
  const describedBy =
    [hint ? hintId : null, errors?.length ? errorId : null]
      .filter(Boolean)
      .join(" ") || undefined;
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-semibold">
        {label}
      </label>
      <input
        id={id}
        name={name}
        aria-invalid={errors?.length ? true : undefined}
        aria-describedby={describedBy}
        className="mt-1 block w-full rounded border border-line bg-panel px-3 py-2 text-sm focus:border-accent focus:outline-2 focus:outline-accent/30 aria-invalid:border-danger"
        {...input}
      />
      {hint ? (
        <p id={hintId} className="mt-1 text-xs text-ink-muted">
          {hint}
        </p>
      ) : null}
      <FieldError id={errorId} errors={errors} />
    </div>
  );
}

export function FieldError({ id, errors }: { id?: string; errors?: string[] }) {
  if (!errors?.length) return null;
  return (
    <p id={id} className="mt-1 text-sm text-danger" role="alert">
      {errors.join(" ")}
    </p>
  );
}

export function FormAlert({
  message,
  tone = "danger",
}: {
  message?: string | null;
  tone?: "danger" | "ok";
}) {
  if (!message) return null;
  const style =
    tone === "ok"
      ? "border-accent bg-accent-soft text-accent-strong"
      : "border-danger/40 bg-red-50 text-danger";
  return (
    <div
      role={tone === "ok" ? "status" : "alert"}
      className={`rounded border px-3 py-2 text-sm ${style}`}
    >
      {message}
    </div>
  );
}

export function Button({
  variant = "primary",
  className = "",
  ...props
}: {
  variant?: "primary" | "secondary" | "danger";
} & React.ButtonHTMLAttributes<HTMLButtonElement>) {
  const styles = {
    primary: "bg-accent text-white hover:bg-accent-strong",
    secondary: "border border-line bg-panel text-ink hover:border-accent",
    danger: "border border-danger/40 bg-panel text-danger hover:bg-red-50",
  }[variant];
  return (
    <button
      className={`inline-flex items-center justify-center rounded px-4 py-2 text-sm font-semibold disabled:opacity-50 ${styles} ${className}`}
      {...props}
    />
  );
}
