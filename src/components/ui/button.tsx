import type { ButtonHTMLAttributes } from 'react';

type Tone = 'primary' | 'plain' | 'danger' | 'quiet';

const tones: Record<Tone, string> = {
  primary: 'bg-slate-brand text-paper hover:bg-ink disabled:bg-ink-faint',
  plain:
    'border border-line-strong bg-paper-raised text-ink hover:bg-paper-sunk disabled:text-ink-faint',
  danger: 'border border-sev-act/40 bg-paper-raised text-sev-act hover:bg-sev-act/10',
  quiet: 'text-ink-soft hover:bg-paper-sunk hover:text-ink',
};

export function Button({
  tone = 'plain',
  size = 'md',
  className = '',
  type = 'button',
  ...rest
}: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: Tone; size?: 'sm' | 'md' }) {
  return (
    <button
      type={type}
      className={
        'inline-flex items-center justify-center gap-1.5 rounded font-medium transition-colors disabled:cursor-not-allowed ' +
        (size === 'sm' ? 'px-2 py-1 text-xs ' : 'px-3 py-1.5 text-sm ') +
        tones[tone] +
        ' ' +
        className
      }
      {...rest}
    />
  );
}
