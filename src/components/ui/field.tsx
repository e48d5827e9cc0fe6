import {
  forwardRef,
  useId,
  type InputHTMLAttributes,
  type ReactNode,
  type SelectHTMLAttributes,
} from 'react';

const control =
  'w-full rounded border bg-paper-raised px-2.5 py-1.5 text-sm text-ink outline-none focus:border-slate-brand focus:ring-1 focus:ring-slate-brand ';

interface FieldProps {
  label: ReactNode;
  error?: string | undefined;
  hint?: ReactNode;
}

/** A labelled input whose error is announced and tied to it with aria-describedby. */
export const TextField = forwardRef<
  HTMLInputElement,
  InputHTMLAttributes<HTMLInputElement> & FieldProps & { numeric?: boolean }
>(function TextField({ label, error, hint, numeric, className = '', ...input }, ref) {
  const id = useId();
  const described = error ? `${id}-error` : hint ? `${id}-hint` : undefined;
  return (
    <div className={className}>
      <label htmlFor={id} className="mb-1 block text-xs font-medium text-ink-soft">
        {label}
      </label>
      <input
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={described}
        className={control + (error ? 'border-sev-act ' : 'border-line ') + (numeric ? 'num' : '')}
        {...input}
      />
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-xs text-sev-act">
          {error}
        </p>
      ) : hint ? (
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
    </div>
  );
});

export const SelectField = forwardRef<
  HTMLSelectElement,
  SelectHTMLAttributes<HTMLSelectElement> & FieldProps
>(function SelectField({ label, error, hint, className = '', children, ...select }, ref) {
  const id = useId();
  return (
    <div className={className}>
      <label htmlFor={id} className="mb-1 block text-xs font-medium text-ink-soft">
        {label}
      </label>
      <select
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className={control + (error ? 'border-sev-act' : 'border-line')}
        {...select}
      >
        {children}
      </select>
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-xs text-sev-act">
          {error}
        </p>
      ) : hint ? (
        <p className="mt-1 text-xs text-ink-faint">{hint}</p>
      ) : null}
    </div>
  );
});

export const TextAreaField = forwardRef<
  HTMLTextAreaElement,
  React.TextareaHTMLAttributes<HTMLTextAreaElement> & FieldProps
>(function TextAreaField({ label, error, hint, className = '', ...area }, ref) {
  const id = useId();
  return (
    <div className={className}>
      <label htmlFor={id} className="mb-1 block text-xs font-medium text-ink-soft">
        {label}
      </label>
      <textarea
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className={control + (error ? 'border-sev-act' : 'border-line')}
        {...area}
      />
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-xs text-sev-act">
          {error}
        </p>
      ) : hint ? (
        <p className="mt-1 text-xs text-ink-faint">{hint}</p>
      ) : null}
    </div>
  );
});
