import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { signInRequestSchema, type SignInRequest } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { FormPage } from '@/components/ui/form-page.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import { TextLink } from '@/components/ui/text-link.tsx';
import { useSignIn } from '@/features/auth/api/sign-in.ts';
import { applyServerErrors } from '@/lib/form-errors.ts';
import { homePathFor, safeNextPath } from '@/lib/session.ts';

/** Sign-in; afterwards back to where a 401 interrupted, or to the first organization's home. */
export function SignInPage() {
  const [params] = useSearchParams();
  const next = safeNextPath(params.get('next'));
  const navigate = useNavigate();
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    resetField,
    setFocus,
    formState: { errors, isSubmitting },
  } = useForm<SignInRequest>({
    resolver: zodResolver(signInRequestSchema),
    defaultValues: { email: '', password: '' },
  });

  async function onValid(values: SignInRequest) {
    setFormError(null);
    try {
      const me = await signIn.mutateAsync(values);
      await navigate(next ?? homePathFor(me), { replace: true });
    } catch (error) {
      const message = applyServerErrors(error, setError, ['email', 'password']);
      setFormError(message);
      if (message) {
        resetField('password');
        setFocus('password');
      }
    }
  }

  return (
    <FormPage
      title="Sign in"
      intro={
        next
          ? 'Sign in to continue where you were.'
          : 'Use the e-mail address your organization invited.'
      }
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
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          error={errors.password?.message}
          {...register('password')}
        />
        <Button type="submit" className="mt-2" disabled={isSubmitting}>
          {isSubmitting ? 'Signing in…' : 'Sign in'}
        </Button>
      </form>
      <p className="text-sm">
        <TextLink to="/forgot-password">Forgot your password?</TextLink>
      </p>
    </FormPage>
  );
}
