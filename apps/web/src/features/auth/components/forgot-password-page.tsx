import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { passwordResetRequestSchema } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { FormPage } from '@/components/ui/form-page.tsx';
import { ErrorMessage, SuccessMessage } from '@/components/ui/message.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import { TextLink } from '@/components/ui/text-link.tsx';
import { useRequestPasswordReset } from '@/features/auth/api/request-password-reset.ts';
import { applyServerErrors } from '@/lib/form-errors.ts';

type ForgotPasswordForm = z.input<typeof passwordResetRequestSchema>;
type ForgotPasswordValues = z.output<typeof passwordResetRequestSchema>;

/** The confirmation never says whether the address has an account. */
export const resetRequestedText =
  'If an account uses this address, a link to choose a new password is on its way. It works once, within one hour.';

export function ForgotPasswordPage() {
  const requestReset = useRequestPasswordReset();
  const [formError, setFormError] = useState<string | null>(null);
  const [sent, setSent] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<ForgotPasswordForm, unknown, ForgotPasswordValues>({
    resolver: zodResolver(passwordResetRequestSchema),
    defaultValues: { email: '' },
  });

  async function onValid(values: ForgotPasswordValues) {
    setFormError(null);
    try {
      await requestReset.mutateAsync(values);
      setSent(true);
    } catch (error) {
      setFormError(applyServerErrors(error, setError, ['email']));
    }
  }

  if (sent) {
    return (
      <FormPage title="Check your e-mail">
        <SuccessMessage>{resetRequestedText}</SuccessMessage>
        <p className="text-sm">
          <TextLink to="/sign-in">Back to sign-in</TextLink>
        </p>
      </FormPage>
    );
  }

  return (
    <FormPage
      title="Forgot your password?"
      intro="Enter your e-mail address and we will send you a link to choose a new password."
    >
      {formError ? <ErrorMessage>{formError}</ErrorMessage> : null}
      <form
        noValidate
        className="flex flex-col gap-4"
        onSubmit={(event) => void handleSubmit(onValid)(event)}
      >
        <TextField
          label="E-mail"
          type="email"
          autoComplete="email"
          error={errors.email?.message}
          {...register('email')}
        />
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Sending…' : 'Send reset link'}
        </Button>
      </form>
      <p className="text-sm">
        <TextLink to="/sign-in">Back to sign-in</TextLink>
      </p>
    </FormPage>
  );
}
