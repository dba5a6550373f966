import type { Role } from '@biasproof/shared';
import { Card } from '@/components/ui/card.tsx';
import { RoleList } from '@/components/ui/role-list.tsx';
import { useCurrentOrg } from '@/lib/current-org.tsx';

/** What will wait for a person in each role, said in the empty state. */
const waitingFor: Record<Role, string> = {
  admin: 'invitations that bounce or expire',
  author: 'your drafts and the revisions returned to you',
  checker: 'revisions submitted for your check',
  approver: 'checked revisions awaiting your signature',
  manager: 'worksheets that need a checker or approver assigned',
};

/** `/o/:orgSlug`: the organization's home, the person's queue (worksheets arrive later). */
export function MyQueuePage() {
  const { membership, user } = useCurrentOrg();
  return (
    <div className="mx-auto flex w-full max-w-5xl flex-col gap-8">
      <title>{`My queue · ${membership.orgName} · Biasproof`}</title>
      <div>
        <p className="text-sm font-semibold text-ink-600">{membership.orgName}</p>
        <h1 className="text-3xl font-bold text-ink-900">My queue</h1>
        <p className="mt-2 text-ink-700">Welcome, {user.name}.</p>
      </div>

      <div className="grid gap-6 md:grid-cols-[2fr_1fr]">
        <Card aria-labelledby="queue-empty-heading" className="flex flex-col gap-3">
          <h2 id="queue-empty-heading" className="text-lg font-semibold text-ink-900">
            Nothing waits for you right now
          </h2>
          <p className="text-ink-700">
            When there is work for you in {membership.orgName}, it lands here:
          </p>
          <ul className="list-disc pl-6 text-ink-700">
            {membership.roles.map((role) => (
              <li key={role}>{waitingFor[role]}</li>
            ))}
          </ul>
        </Card>

        <Card aria-labelledby="my-roles-heading">
          <h2 id="my-roles-heading" className="mb-3 text-lg font-semibold text-ink-900">
            Your roles here
          </h2>
          <RoleList roles={membership.roles} />
        </Card>
      </div>
    </div>
  );
}
