import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { signInRequestSchema, type SignInRequest } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { Card } from '@/components/ui/card.tsx';
import { TextField } from '@/components/ui/text-field.tsx';

const signInFormSchema = signInRequestSchema;
type SignInForm = SignInRequest;

/**
 * Placeholder until accounts exist: the form validates its fields the way the real one will,
 * then explains that signing in is not available yet.
 */
export function SignInPage() {
  const [submitted, setSubmitted] = useState(false);
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = useForm<SignInForm>({
    resolver: zodResolver(signInFormSchema),
    defaultValues: { email: '', password: '' },
  });

  const onValid = () => setSubmitted(true);

  return (
    <div className="mx-auto w-full max-w-md">
      <title>Sign in · Biasproof</title>
      <Card aria-labelledby="sign-in-heading">
        <h1 id="sign-in-heading" className="text-2xl font-bold text-ink-900">
          Sign in
        </h1>
        <p className="mt-2 text-ink-600">Use the e-mail address your organization invited.</p>

        <form
          noValidate
          className="mt-6 flex flex-col gap-4"
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
          <Button type="submit" className="mt-2">
            Sign in
          </Button>
        </form>

        <p aria-live="polite" className="mt-4 text-sm text-ink-700">
          {submitted ? 'Accounts are not switched on yet: signing in arrives with them.' : ''}
        </p>
      </Card>
    </div>
  );
}
