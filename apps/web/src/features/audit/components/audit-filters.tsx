import { useForm } from 'react-hook-form';
import { auditListQuerySchema } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { SelectField } from '@/components/ui/select-field.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import { filterKeys, type AuditFilters } from '@/features/audit/components/audit-params.ts';

/** A choice in a filter list (people, projects, worksheets). */
export interface FilterOption {
  id: string;
  label: string;
}

/** Action names the server writes, offered as suggestions (the field takes any exact name). */
const knownActions = [
  'organization.created',
  'account.created',
  'account.renamed',
  'account.notifications-changed',
  'auth.signed-in',
  'auth.signed-out',
  'auth.password-changed',
  'auth.password-reset-requested',
  'auth.password-reset',
  'auth.locked',
  'member.added',
  'member.roles-changed',
  'member.disabled',
  'member.enabled',
  'member.removed',
  'invitation.created',
  'invitation.resent',
  'invitation.revoked',
  'invitation.accepted',
  'project.created',
  'project.updated',
  'project.archived',
  'project.restored',
  'worksheet.created',
  'worksheet.updated',
  'worksheet.assigned',
  'worksheet.computed',
  'worksheet.deck-imported',
  'worksheet.submitted',
  'worksheet.returned',
  'worksheet.accepted',
  'worksheet.signed',
  'worksheet.withdrawn',
  'worksheet.revised',
  'worksheet.signature-refused',
  'finding.raised',
  'finding.answered',
  'finding.closed',
  'finding.reopened',
  'attachment.uploaded',
  'attachment.downloaded',
  'attachment.deleted',
  'model.created',
  'model.updated',
  'model.deleted',
  'audit.exported',
];

/** Date range, person, action, project and worksheet; applying them changes the address. */
export function AuditFiltersForm({
  filters,
  people,
  projects,
  worksheets,
  onApply,
}: {
  filters: AuditFilters;
  people: readonly FilterOption[];
  projects: readonly FilterOption[];
  worksheets: readonly FilterOption[];
  onApply: (filters: AuditFilters) => void;
}) {
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<AuditFilters>({ values: filters });

  // The server's query schema judges the filters; empty ones are simply not sent.
  function onValid(values: AuditFilters) {
    const sent = Object.fromEntries(filterKeys.filter((k) => values[k]).map((k) => [k, values[k]]));
    const parsed = auditListQuerySchema.safeParse(sent);
    let valid = parsed.success;
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const key = issue.path[0];
        if (typeof key === 'string' && (filterKeys as readonly string[]).includes(key)) {
          setError(key as keyof AuditFilters, { type: 'validate', message: issue.message });
        }
      }
    }
    if (values.from && values.to && values.from > values.to) {
      setError('to', { type: 'validate', message: 'The end comes before the start.' });
      valid = false;
    }
    if (valid) onApply(values);
  }

  const empty: AuditFilters = {
    from: '',
    to: '',
    actor: '',
    action: '',
    project: '',
    worksheet: '',
  };
  return (
    <form
      aria-label="Filter the audit log"
      noValidate
      onSubmit={(event) => void handleSubmit(onValid)(event)}
      className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3"
    >
      <TextField
        label="From (date)"
        type="date"
        error={errors.from?.message}
        {...register('from')}
      />
      <TextField
        label="To (date, inclusive)"
        type="date"
        error={errors.to?.message}
        {...register('to')}
      />
      <SelectField label="Person" error={errors.actor?.message} {...register('actor')}>
        <option value="">Anyone</option>
        {people.map((p) => (
          <option key={p.id} value={p.id}>
            {p.label}
          </option>
        ))}
      </SelectField>
      <TextField
        label="Action"
        list="audit-action-names"
        autoComplete="off"
        spellCheck={false}
        hint="An exact name such as worksheet.signed."
        error={errors.action?.message}
        {...register('action')}
      />
      <datalist id="audit-action-names">
        {knownActions.map((a) => (
          <option key={a} value={a} />
        ))}
      </datalist>
      <SelectField label="Project" error={errors.project?.message} {...register('project')}>
        <option value="">Any project</option>
        {projects.map((p) => (
          <option key={p.id} value={p.id}>
            {p.label}
          </option>
        ))}
      </SelectField>
      <SelectField label="Worksheet" error={errors.worksheet?.message} {...register('worksheet')}>
        <option value="">Any worksheet</option>
        {worksheets.map((w) => (
          <option key={w.id} value={w.id}>
            {w.label}
          </option>
        ))}
      </SelectField>
      <div className="flex flex-wrap items-end gap-3 sm:col-span-2 lg:col-span-3">
        <Button type="submit">Apply filters</Button>
        <Button
          variant="outline"
          onClick={() => {
            reset(empty);
            onApply(empty);
          }}
        >
          Clear filters
        </Button>
      </div>
    </form>
  );
}
