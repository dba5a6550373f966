import type { ComponentProps } from 'react';

type ButtonProps = ComponentProps<'button'> & { variant?: 'primary' | 'quiet' };

const variantClasses = {
  primary: 'bg-accent text-white hover:bg-accent-strong disabled:opacity-60',
  quiet: 'bg-transparent text-accent hover:bg-accent-tint',
} as const;

export function Button({
  variant = 'primary',
  className = '',
  type = 'button',
  ...props
}: ButtonProps) {
  return (
    <button
      type={type}
      className={`inline-flex items-center justify-center rounded-md px-4 py-2 text-sm font-semibold focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent ${variantClasses[variant]} ${className}`}
      {...props}
    />
  );
}
