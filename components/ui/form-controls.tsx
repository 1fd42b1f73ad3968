import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes, TextareaHTMLAttributes } from "react";

type FieldErrors = Record<string, string[] | undefined> | undefined;
type EchoedValues = Record<string, string> | undefined;

/**
 * Label, hint and error around one control; the control gets the returned attributes, so a screen reader announces
 * the hint and the error with it.
 */
function LabelledField({
  name,
  label,
  hint,
  messages,
  children,
}: {
  name: string;
  label: ReactNode;
  hint?: ReactNode;
  messages: string[] | undefined;
  children: (control: { id: string; "aria-invalid": true | undefined; "aria-describedby": string | undefined }) => ReactNode;
}) {
  const describedBy = [hint ? `${name}-hint` : null, messages?.length ? `${name}-error` : null].filter(Boolean).join(" ");
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={name} className="text-sm font-semibold text-ink">
        {label}
      </label>
      {children({ id: name, "aria-invalid": messages?.length ? true : undefined, "aria-describedby": describedBy || undefined })}
      {hint ? (
        <p id={`${name}-hint`} className="text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
      <FieldError id={`${name}-error`} messages={messages} />
    </div>
  );
}

const textControlClass = "rounded border border-rule bg-paper-raised px-3 py-2 text-base text-ink aria-invalid:border-copper";

export function TextField({
  label,
  name,
  errors,
  values,
  hint,
  ...input
}: { label: string; name: string; errors?: FieldErrors; values?: EchoedValues; hint?: ReactNode } & InputHTMLAttributes<HTMLInputElement>) {
  return (
    <LabelledField name={name} label={label} hint={hint} messages={errors?.[name]}>
      {(control) => <input {...control} name={name} className={textControlClass} defaultValue={values?.[name]} {...input} />}
    </LabelledField>
  );
}

export function SelectField({
  label,
  name,
  errors,
  children,
  ...select
}: { label: string; name: string; errors?: FieldErrors; children: ReactNode } & SelectHTMLAttributes<HTMLSelectElement>) {
  const messages = errors?.[name];
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={select.id ?? name} className="text-sm font-semibold text-ink">
        {label}
      </label>
      <select
        id={select.id ?? name}
        name={name}
        aria-invalid={messages?.length ? true : undefined}
        aria-describedby={messages?.length ? `${select.id ?? name}-error` : undefined}
        className="rounded border border-rule bg-paper-raised px-3 py-2 text-base text-ink aria-invalid:border-copper"
        {...select}
      >
        {children}
      </select>
      <FieldError id={`${select.id ?? name}-error`} messages={messages} />
    </div>
  );
}

function FieldError({ id, messages }: { id: string; messages: string[] | undefined }) {
  if (!messages?.length) return null;
  return (
    <p id={id} className="text-sm text-copper-deep">
      {messages.join(" ")}
    </p>
  );
}

export function SubmitButton({ children, pending }: { children: ReactNode; pending: boolean }) {
  return (
    <button
      type="submit"
      disabled={pending}
      className="rounded bg-ink px-4 py-2 font-semibold text-paper-raised hover:bg-ink-soft disabled:opacity-60"
    >
      {pending ? "Working…" : children}
    </button>
  );
}

export function FormStatus({ status, message }: { status: string; message?: string }) {
  return (
    <p aria-live="polite" role="status" className={`min-h-5 text-sm ${status === "ok" ? "text-verdigris-deep" : "text-copper-deep"}`}>
      {status !== "idle" ? message : null}
    </p>
  );
}

export function TextAreaField({
  label,
  name,
  errors,
  values,
  hint,
  ...textarea
}: { label: string; name: string; errors?: FieldErrors; values?: EchoedValues; hint?: ReactNode } & TextareaHTMLAttributes<HTMLTextAreaElement>) {
  return (
    <LabelledField name={name} label={label} hint={hint} messages={errors?.[name]}>
      {(control) => <textarea {...control} name={name} className={textControlClass} defaultValue={values?.[name]} {...textarea} />}
    </LabelledField>
  );
}

export function CheckboxField({
  label,
  name,
  errors,
  hint,
  ...input
}: { label: ReactNode; name: string; errors?: FieldErrors; hint?: ReactNode } & InputHTMLAttributes<HTMLInputElement>) {
  const messages = errors?.[name];
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={input.id ?? name} className="flex items-start gap-2 text-sm text-ink">
        <input
          id={input.id ?? name}
          name={name}
          type="checkbox"
          aria-invalid={messages?.length ? true : undefined}
          aria-describedby={messages?.length ? `${input.id ?? name}-error` : undefined}
          className="mt-1 size-4 accent-copper"
          {...input}
        />
        <span>{label}</span>
      </label>
      {hint ? <p className="pl-6 text-xs text-ink-faint">{hint}</p> : null}
      <FieldError id={`${input.id ?? name}-error`} messages={messages} />
    </div>
  );
}
