import { useState } from 'react';
import { useForm } from 'react-hook-form';
import {
  findingAnswerRequestSchema,
  findingCommentRequestSchema,
  findingReplyRequestSchema,
  type Finding,
} from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { TextAreaField } from '@/components/ui/text-area-field.tsx';
import { useMoveFinding, type FindingStep } from '@/features/review/api/move-finding.ts';
import { useReplyToFinding } from '@/features/review/api/reply-to-finding.ts';

type Step = FindingStep | 'reply';

/** What the person may do in a finding's thread (from the shared rules and the status). */
export interface ThreadRights {
  answer: boolean;
  close: boolean;
  reopen: boolean;
  reply: boolean;
}

const stepSchemas = {
  answer: findingAnswerRequestSchema,
  close: findingCommentRequestSchema,
  reopen: findingCommentRequestSchema,
  reply: findingReplyRequestSchema,
} as const;

const stepLabels: Record<Step, string> = {
  answer: 'Answer',
  close: 'Close finding',
  reopen: 'Reopen',
  reply: 'Reply',
};

/** One text box under a finding and the buttons the person's rights allow. */
export function FindingComposer({
  orgId,
  worksheetId,
  finding,
  rights,
}: {
  orgId: string;
  worksheetId: string;
  finding: Finding;
  rights: ThreadRights;
}) {
  const move = useMoveFinding(orgId, worksheetId);
  const reply = useReplyToFinding(orgId, worksheetId);
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState<Step | null>(null);
  const {
    register,
    getValues,
    setError,
    clearErrors,
    reset,
    formState: { errors },
  } = useForm<{ text: string }>({ defaultValues: { text: '' } });

  const steps = (['answer', 'close', 'reopen', 'reply'] as const).filter((s) => rights[s]);
  if (steps.length === 0) return null;

  // Each button checks the text against its own request schema: an answer or a reply needs
  // words, closing and reopening may go without.
  async function run(step: Step) {
    setProblem(null);
    clearErrors();
    const parsed = stepSchemas[step].safeParse({ text: getValues('text') });
    if (!parsed.success) {
      const message = parsed.error.issues[0]?.message ?? 'Write something first.';
      setError('text', { type: 'validate', message }, { shouldFocus: true });
      return;
    }
    setBusy(step);
    try {
      if (step === 'reply')
        await reply.mutateAsync({ findingId: finding.id, text: parsed.data.text });
      else await move.mutateAsync({ findingId: finding.id, step, text: parsed.data.text });
      reset({ text: '' });
    } catch (error) {
      setProblem(error instanceof Error ? error.message : 'That did not work.');
    } finally {
      setBusy(null);
    }
  }

  return (
    <form
      noValidate
      aria-label={`Respond to the finding on ${finding.path}`}
      onSubmit={(event) => {
        event.preventDefault();
        const first = steps[0];
        if (first) void run(first);
      }}
      className="flex flex-col gap-2"
    >
      {problem ? <ErrorMessage>{problem}</ErrorMessage> : null}
      <TextAreaField
        label={rights.answer ? 'Your answer or reply' : 'Your comment'}
        rows={2}
        error={errors.text?.message}
        {...register('text')}
      />
      <div className="flex flex-wrap gap-2">
        {steps.map((step, index) => (
          <Button
            key={step}
            type={index === 0 ? 'submit' : 'button'}
            size="sm"
            variant={index === 0 ? 'primary' : 'outline'}
            disabled={busy !== null}
            onClick={index === 0 ? undefined : () => void run(step)}
          >
            {busy === step ? 'Sending…' : stepLabels[step]}
          </Button>
        ))}
      </div>
    </form>
  );
}
