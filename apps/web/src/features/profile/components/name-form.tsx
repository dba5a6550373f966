import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { updateProfileRequestSchema } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage, SuccessMessage } from '@/components/ui/message.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import {
  useUpdateProfile,
  type UpdateProfileRequest,
} from '@/features/profile/api/update-profile.ts';
import { applyServerErrors } from '@/lib/form-errors.ts';

type NameFormInput = z.input<typeof updateProfileRequestSchema>;

export function NameForm({ currentName }: { currentName: string }) {
  const update = useUpdateProfile();
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<NameFormInput, unknown, UpdateProfileRequest>({
    resolver: zodResolver(updateProfileRequestSchema),
    defaultValues: { name: currentName },
  });

  async function onValid(values: UpdateProfileRequest) {
    setMessage(null);
    try {
      const me = await update.mutateAsync(values);
      reset({ name: me.user.name });
      setMessage({ ok: true, text: 'Your name is saved.' });
    } catch (error) {
      const text = applyServerErrors(error, setError, ['name']);
      if (text) setMessage({ ok: false, text });
    }
  }

  return (
    <form
      noValidate
      className="flex flex-col gap-4"
      onSubmit={(event) => void handleSubmit(onValid)(event)}
    >
      {message?.ok ? <SuccessMessage>{message.text}</SuccessMessage> : null}
      {message && !message.ok ? <ErrorMessage>{message.text}</ErrorMessage> : null}
      <TextField
        label="Your name"
        autoComplete="name"
        className="max-w-md"
        hint="Shown to colleagues on worksheets, findings and signatures."
        error={errors.name?.message}
        {...register('name')}
      />
      <div>
        <Button type="submit" disabled={isSubmitting || !isDirty}>
          {isSubmitting ? 'Saving…' : 'Save name'}
        </Button>
      </div>
    </form>
  );
}
