import { forwardRef, type InputHTMLAttributes, type SelectHTMLAttributes, type TextareaHTMLAttributes } from "react";

const inputClass =
  "w-full rounded-md border border-rule bg-card px-3 py-2 text-sm text-ink placeholder:text-ink-soft/60 focus:border-moss focus:outline-none";

interface FieldProps {
  label: string;
  error?: string;
  hint?: string;
  name: string;
}

function Wrap({ label, error, hint, name, children }: FieldProps & { children: React.ReactNode }) {
  // Nesting labels the field's own control; `htmlFor={name}` would label the first element with
  // that id on the page (two forms with a "name" field on /account).
  return (
    <label className="block space-y-1">
      <span className="text-sm font-medium text-ink">{label}</span>
      {children}
      {hint && !error && <span className="block text-xs text-ink-soft">{hint}</span>}
      {error && (
        <span className="block text-xs text-brick" data-testid={`error-${name}`}>
          {error}
        </span>
      )}
    </label>
  );
}

export const TextField = forwardRef<HTMLInputElement, FieldProps & InputHTMLAttributes<HTMLInputElement>>(
  function TextField({ label, error, hint, name, ...rest }, ref) {
    return (
      <Wrap label={label} error={error} hint={hint} name={name}>
        <input id={name} name={name} ref={ref} aria-invalid={!!error} className={inputClass} {...rest} />
      </Wrap>
    );
  },
);

export const TextArea = forwardRef<HTMLTextAreaElement, FieldProps & TextareaHTMLAttributes<HTMLTextAreaElement>>(
  function TextArea({ label, error, hint, name, ...rest }, ref) {
    return (
      <Wrap label={label} error={error} hint={hint} name={name}>
        <textarea id={name} name={name} ref={ref} aria-invalid={!!error} rows={3} className={inputClass} {...rest} />
      </Wrap>
    );
  },
);

export const SelectField = forwardRef<
  HTMLSelectElement,
  FieldProps & SelectHTMLAttributes<HTMLSelectElement> & { options: { value: string; label: string }[] }
>(function SelectField({ label, error, hint, name, options, ...rest }, ref) {
  return (
    <Wrap label={label} error={error} hint={hint} name={name}>
      <select id={name} name={name} ref={ref} aria-invalid={!!error} className={inputClass} {...rest}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </Wrap>
  );
});
