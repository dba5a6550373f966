import { useId } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';
import { roleDescriptions, roles } from '@biasproof/shared';
import { roleLabel } from '@/components/ui/role-list.tsx';

interface RoleCheckboxesProps {
  legend: string;
  /** `register('roles')`, shared by all five boxes (react-hook-form makes it an array). */
  registration: UseFormRegisterReturn;
  error?: string | undefined;
  /** In a table row: boxes side by side, the role descriptions for screen readers and tooltips. */
  compact?: boolean;
}

/** One checkbox per role, each described by what the role may do. */
export function RoleCheckboxes({
  legend,
  registration,
  error,
  compact = false,
}: RoleCheckboxesProps) {
  const id = useId();
  return (
    <fieldset aria-describedby={error ? `${id}-error` : undefined} className="min-w-0">
      <legend className={compact ? 'sr-only' : 'mb-2 text-sm font-semibold text-ink-700'}>
        {legend}
      </legend>
      <div className={compact ? 'flex flex-wrap gap-x-4 gap-y-1' : 'flex flex-col gap-2'}>
        {roles.map((role) => (
          <div key={role} className="flex items-start gap-2" title={roleDescriptions[role]}>
            <input
              id={`${id}-${role}`}
              type="checkbox"
              value={role}
              aria-describedby={`${id}-${role}-help`}
              className="mt-1 size-4 accent-accent"
              {...registration}
            />
            <div>
              <label htmlFor={`${id}-${role}`} className="font-semibold text-ink-900">
                {roleLabel(role)}
              </label>
              <p id={`${id}-${role}-help`} className={compact ? 'sr-only' : 'text-sm text-ink-600'}>
                {roleDescriptions[role]}
              </p>
            </div>
          </div>
        ))}
      </div>
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-sm font-semibold text-fault">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}
