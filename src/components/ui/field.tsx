import { forwardRef, useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

const control =
  'w-full min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-3 text-base text-ink focus:border-harbour-600 aria-[invalid=true]:border-stop-700';

interface FieldShell {
  label: string;
  error?: string;
  hint?: ReactNode;
}

function Shell({ id, label, error, hint, children }: FieldShell & { id: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-bold text-sm text-ink">
        {label}
      </label>
      {children}
      {hint && !error && <p className="text-sm text-harbour-700">{hint}</p>}
      {error && (
        <p role="alert" className="text-sm font-bold text-stop-700">
          {error}
        </p>
      )}
    </div>
  );
}

export const TextField = forwardRef<HTMLInputElement, InputHTMLAttributes<HTMLInputElement> & FieldShell>(function TextField(
  { label, error, hint, id, className = '', ...props },
  ref,
) {
  const auto = useId();
  const fieldId = id ?? auto;
  return (
    <Shell id={fieldId} label={label} error={error} hint={hint}>
      <input ref={ref} id={fieldId} aria-invalid={!!error} className={`${control} ${className}`} {...props} />
    </Shell>
  );
});

export const SelectField = forwardRef<HTMLSelectElement, SelectHTMLAttributes<HTMLSelectElement> & FieldShell>(function SelectField(
  { label, error, hint, id, className = '', children, ...props },
  ref,
) {
  const auto = useId();
  const fieldId = id ?? auto;
  return (
    <Shell id={fieldId} label={label} error={error} hint={hint}>
      <select ref={ref} id={fieldId} aria-invalid={!!error} className={`${control} ${className}`} {...props}>
        {children}
      </select>
    </Shell>
  );
});

export const TextAreaField = forwardRef<HTMLTextAreaElement, TextareaHTMLAttributes<HTMLTextAreaElement> & FieldShell>(function TextAreaField(
  { label, error, hint, id, className = '', ...props },
  ref,
) {
  const auto = useId();
  const fieldId = id ?? auto;
  return (
    <Shell id={fieldId} label={label} error={error} hint={hint}>
      <textarea ref={ref} id={fieldId} aria-invalid={!!error} className={`${control} py-2 ${className}`} {...props} />
    </Shell>
  );
});

export function CheckboxField({ label, ...props }: InputHTMLAttributes<HTMLInputElement> & { label: string }) {
  const id = useId();
  return (
    <label htmlFor={id} className="flex min-h-11 items-center gap-3 font-bold text-sm">
      <input id={id} type="checkbox" className="h-6 w-6 accent-harbour-800" {...props} />
      {label}
    </label>
  );
}
