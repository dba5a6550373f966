import { roleDescriptions, type Role } from '@biasproof/shared';

/** The word a person reads for a role. */
export function roleLabel(role: Role): string {
  return role.charAt(0).toUpperCase() + role.slice(1);
}

/** Roles with what each lets the person do. */
export function RoleList({ roles }: { roles: readonly Role[] }) {
  return (
    <dl className="flex flex-col gap-2">
      {roles.map((role) => (
        <div key={role}>
          <dt className="font-semibold text-ink-900">{roleLabel(role)}</dt>
          <dd className="text-sm text-ink-600">{roleDescriptions[role]}</dd>
        </div>
      ))}
    </dl>
  );
}

/** Roles as small chips, e.g. in a table cell. */
export function RoleChips({ roles }: { roles: readonly Role[] }) {
  return (
    <ul className="flex flex-wrap gap-1" aria-label="Roles">
      {roles.map((role) => (
        <li
          key={role}
          title={roleDescriptions[role]}
          className="rounded-full bg-accent-tint px-2 py-0.5 text-xs font-semibold text-accent-strong"
        >
          {roleLabel(role)}
        </li>
      ))}
    </ul>
  );
}
