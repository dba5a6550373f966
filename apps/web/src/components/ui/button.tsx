import type { ComponentProps } from 'react';

type ButtonProps = ComponentProps<'button'> & {
  variant?: 'primary' | 'quiet' | 'outline' | 'danger' | 'dangerOutline';
  size?: 'md' | 'sm';
};

const variantClasses = {
  primary: 'bg-accent text-white hover:bg-accent-strong',
  quiet: 'bg-transparent text-accent hover:bg-accent-tint',
  outline: 'border border-ink-500 bg-surface text-ink-900 hover:bg-paper',
  danger: 'bg-fault text-white hover:bg-ink-900',
  dangerOutline: 'border border-fault bg-surface text-fault hover:bg-fault-tint',
} as const;

const sizeClasses = { md: 'px-4 py-2 text-sm', sm: 'px-2.5 py-1 text-sm' } as const;

export function Button({
  variant = 'primary',
  size = 'md',
  className = '',
  type = 'button',
  ...props
}: ButtonProps) {
  return (
    <button
      type={type}
      className={`inline-flex items-center justify-center rounded-md font-semibold focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent disabled:cursor-not-allowed disabled:opacity-60 ${sizeClasses[size]} ${variantClasses[variant]} ${className}`}
      {...props}
    />
  );
}
