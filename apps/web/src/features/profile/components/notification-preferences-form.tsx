import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import {
  notificationPreferencesSchema,
  type NotificationPreferences,
  type NotificationPreferencesInput,
} from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage, LoadingMessage, SuccessMessage } from '@/components/ui/message.tsx';
import { SelectField } from '@/components/ui/select-field.tsx';
import { useNotificationPreferences } from '@/features/profile/api/get-notification-preferences.ts';
import { useUpdateNotificationPreferences } from '@/features/profile/api/update-notification-preferences.ts';
import { applyServerErrors } from '@/lib/form-errors.ts';

const hours = Array.from({ length: 24 }, (_, h) => h);
const two = (n: number) => String(n).padStart(2, '0');

/** The UTC hour with the reader's own clock beside it, e.g. "07:00 UTC (08:00 here)". */
function hourLabel(hourUtc: number): string {
  const at = new Date(Date.UTC(2026, 0, 15, hourUtc));
  const local = `${two(at.getHours())}:${two(at.getMinutes())}`;
  return `${two(hourUtc)}:00 UTC (${local} here)`;
}

function PreferencesForm({ saved }: { saved: NotificationPreferences }) {
  const update = useUpdateNotificationPreferences();
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const {
    register,
    handleSubmit,
    watch,
    setError,
    reset,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<NotificationPreferencesInput, unknown, NotificationPreferences>({
    resolver: zodResolver(notificationPreferencesSchema),
    defaultValues: saved,
  });
  const digest = watch('delivery') === 'daily-digest';

  async function onValid(values: NotificationPreferences) {
    setMessage(null);
    try {
      const stored = await update.mutateAsync(values);
      reset(stored);
      setMessage({
        ok: true,
        text:
          stored.delivery === 'immediate'
            ? 'Saved: workflow e-mail reaches you as it happens.'
            : `Saved: one digest a day at ${hourLabel(stored.digestHourUtc)}.`,
      });
    } catch (error) {
      const text = applyServerErrors(error, setError, ['delivery', 'digestHourUtc']);
      if (text) setMessage({ ok: false, text });
    }
  }

  return (
    <form
      noValidate
      aria-label="E-mail notifications"
      className="flex flex-col gap-4"
      onSubmit={(event) => void handleSubmit(onValid)(event)}
    >
      {message?.ok ? <SuccessMessage>{message.text}</SuccessMessage> : null}
      {message && !message.ok ? <ErrorMessage>{message.text}</ErrorMessage> : null}
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-semibold text-ink-700">
          Workflow e-mail (submitted, returned, accepted, signed, findings)
        </legend>
        <label className="flex items-start gap-2 text-ink-900">
          <input type="radio" value="immediate" className="mt-1" {...register('delivery')} />
          <span>
            <strong className="font-semibold">Immediately</strong>: one message per event.
          </span>
        </label>
        <label className="flex items-start gap-2 text-ink-900">
          <input type="radio" value="daily-digest" className="mt-1" {...register('delivery')} />
          <span>
            <strong className="font-semibold">Daily digest</strong>: one message a day listing
            everything since the last one.
          </span>
        </label>
        {errors.delivery?.message ? (
          <p className="text-sm font-semibold text-fault">{errors.delivery.message}</p>
        ) : null}
      </fieldset>
      <SelectField
        label="Hour of the digest"
        className="max-w-xs"
        disabled={!digest}
        error={errors.digestHourUtc?.message}
        {...register('digestHourUtc', { valueAsNumber: true })}
      >
        {hours.map((h) => (
          <option key={h} value={h}>
            {hourLabel(h)}
          </option>
        ))}
      </SelectField>
      <p className="text-sm text-ink-600">Invitations and password resets always arrive at once.</p>
      <div>
        <Button type="submit" disabled={isSubmitting || !isDirty}>
          {isSubmitting ? 'Saving…' : 'Save e-mail settings'}
        </Button>
      </div>
    </form>
  );
}

/** How the person receives workflow e-mail: at once, or one daily digest at a chosen hour. */
export function NotificationPreferencesSection() {
  const preferences = useNotificationPreferences();
  if (preferences.isPending) return <LoadingMessage>Loading your e-mail settings…</LoadingMessage>;
  if (preferences.isError) {
    return (
      <ErrorMessage>
        Your e-mail settings could not be loaded: {preferences.error.message}
      </ErrorMessage>
    );
  }
  return <PreferencesForm saved={preferences.data} />;
}
