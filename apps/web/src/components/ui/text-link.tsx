import { Link, type LinkProps } from 'react-router-dom';

/** An in-app link that looks like one (underlined, accent colour). */
export function TextLink({ className = '', ...props }: LinkProps) {
  return (
    <Link
      className={`font-semibold text-accent underline underline-offset-4 hover:text-accent-strong focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent ${className}`}
      {...props}
    />
  );
}
