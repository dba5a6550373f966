import type { ComponentProps } from 'react';
import { FieldFrame } from '@/components/ui/field-frame.tsx';

type TextAreaFieldProps = Omit<ComponentProps<'textarea'>, 'id'> & {
  label: string;
  error?: string | undefined;
  hint?: string;
};

/** A labelled multi-line text field; works with react-hook-form's `register()`. */
export function TextAreaField({ label, error, hint, className, ...props }: TextAreaFieldProps) {
  return (
    <FieldFrame label={label} error={error} hint={hint} className={className}>
      {(control) => <textarea rows={3} {...control} {...props} />}
    </FieldFrame>
  );
}
