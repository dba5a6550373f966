import type { ComponentProps } from 'react';
import { FieldFrame } from '@/components/ui/field-frame.tsx';

type TextFieldProps = Omit<ComponentProps<'input'>, 'id'> & {
  label: string;
  /** Message shown under the field and linked to it as its description. */
  error?: string | undefined;
  hint?: string;
};

/** A labelled input; works with react-hook-form's `register()` (React 19 passes `ref` as a prop). */
export function TextField({ label, error, hint, className, ...inputProps }: TextFieldProps) {
  return (
    <FieldFrame label={label} error={error} hint={hint} className={className}>
      {(control) => <input {...control} {...inputProps} />}
    </FieldFrame>
  );
}
