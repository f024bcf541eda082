import type { ButtonHTMLAttributes } from 'react';

export type ButtonVariant = 'primary' | 'secondary' | 'danger' | 'quiet';

const variants: Record<ButtonVariant, string> = {
  primary: 'bg-accent text-white border-accent hover:bg-accent-strong hover:border-accent-strong',
  secondary: 'bg-panel text-ink border-rule hover:border-accent hover:text-accent-strong',
  danger: 'bg-panel text-danger border-danger hover:bg-danger-soft',
  quiet: 'bg-transparent text-accent-strong border-transparent hover:bg-accent-soft',
};

/** Class names of a button of the given kind, for links that look like buttons. */
export function buttonClasses(variant: ButtonVariant = 'primary', size: 'sm' | 'md' = 'md'): string {
  const pad = size === 'sm' ? 'px-2.5 py-1 text-sm' : 'px-4 py-2';
  return `inline-flex items-center justify-center gap-2 rounded-md border font-medium no-underline transition-colors disabled:cursor-not-allowed disabled:opacity-60 ${pad} ${variants[variant]}`;
}

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: ButtonVariant;
  size?: 'sm' | 'md';
  /** Shows a busy state and blocks a second press while a request is in flight. */
  busy?: boolean;
}

/** Edgeledger's button: one accent for the main action, quieter kinds for the rest. */
export function Button({ variant = 'primary', size = 'md', busy, className = '', type = 'button', children, disabled, ...rest }: ButtonProps) {
  return (
    <button
      type={type}
      className={`${buttonClasses(variant, size)} ${className}`}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      {...rest}
    >
      {children}
    </button>
  );
}
