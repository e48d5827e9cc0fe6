import {
  forwardRef,
  useId,
  type InputHTMLAttributes,
  type ReactNode,
  type SelectHTMLAttributes,
  type TextareaHTMLAttributes,
} from 'react';

const control =
  'w-full rounded border bg-paper-raised px-2.5 py-1.5 text-sm text-ink outline-none focus:border-slate-brand focus:ring-1 focus:ring-slate-brand ';

interface FieldProps {
  label: ReactNode;
  error?: string | undefined;
  hint?: ReactNode;
}

/** Props that tie a control to its label and to the error or hint shown under it. */
function controlProps(id: string, { error, hint }: Omit<FieldProps, 'label'>, extraClass = '') {
  return {
    id,
    'aria-invalid': error ? true : undefined,
    'aria-describedby': error ? `${id}-error` : hint ? `${id}-hint` : undefined,
    className: control + (error ? 'border-sev-act ' : 'border-line-strong ') + extraClass,
  };
}

/** Label above the control, then its error (announced) or else its hint. */
function FieldFrame({
  id,
  label,
  error,
  hint,
  className,
  children,
}: FieldProps & { id: string; className: string; children: ReactNode }) {
  return (
    <div className={className}>
      <label htmlFor={id} className="mb-1 block text-xs font-medium text-ink-soft">
        {label}
      </label>
      {children}
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
}

/** A labelled input whose error is announced and tied to it with aria-describedby. */
export const TextField = forwardRef<
  HTMLInputElement,
  InputHTMLAttributes<HTMLInputElement> & FieldProps & { numeric?: boolean }
>(function TextField({ label, error, hint, numeric, className = '', ...input }, ref) {
  const id = useId();
  return (
    <FieldFrame id={id} label={label} error={error} hint={hint} className={className}>
      <input ref={ref} {...controlProps(id, { error, hint }, numeric ? 'num' : '')} {...input} />
    </FieldFrame>
  );
});

export const SelectField = forwardRef<
  HTMLSelectElement,
  SelectHTMLAttributes<HTMLSelectElement> & FieldProps
>(function SelectField({ label, error, hint, className = '', children, ...select }, ref) {
  const id = useId();
  return (
    <FieldFrame id={id} label={label} error={error} hint={hint} className={className}>
      <select ref={ref} {...controlProps(id, { error, hint })} {...select}>
        {children}
      </select>
    </FieldFrame>
  );
});

export const TextAreaField = forwardRef<
  HTMLTextAreaElement,
  TextareaHTMLAttributes<HTMLTextAreaElement> & FieldProps
>(function TextAreaField({ label, error, hint, className = '', ...area }, ref) {
  const id = useId();
  return (
    <FieldFrame id={id} label={label} error={error} hint={hint} className={className}>
      <textarea ref={ref} {...controlProps(id, { error, hint })} {...area} />
    </FieldFrame>
  );
});
