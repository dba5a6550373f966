import type { QueueResponse, Role } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { Card } from '@/components/ui/card.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { RoleList } from '@/components/ui/role-list.tsx';
import { useQueue } from '@/features/queue/api/get-queue.ts';
import { QueueSection, type QueueSectionCopy } from '@/features/queue/components/queue-section.tsx';
import { useCurrentOrg } from '@/lib/current-org.tsx';

/** What will wait for a person in each role, said in the empty state. */
const waitingFor: Record<Role, string> = {
  admin: 'invitations that bounce or expire',
  author: 'your drafts and the revisions returned to you',
  checker: 'revisions submitted for your check',
  approver: 'checked revisions awaiting your signature',
  manager: 'worksheets that need a checker or approver assigned',
};

const sections: (QueueSectionCopy & { key: keyof QueueResponse })[] = [
  {
    key: 'toCheck',
    id: 'to-check',
    title: 'To check',
    emptyTitle: 'Nothing to check',
    emptyText: 'Revisions submitted with you as their checker land here.',
    person: (w) => `by ${w.author.name}`,
  },
  {
    key: 'toSign',
    id: 'to-sign',
    title: 'To sign',
    emptyTitle: 'Nothing to sign',
    emptyText: 'Checked revisions with you as their approver land here.',
    person: (w) => (w.checker ? `checked by ${w.checker.name}` : null),
  },
  {
    key: 'returnedToMe',
    id: 'returned',
    title: 'Returned to me',
    emptyTitle: 'Nothing returned',
    emptyText: 'Your worksheets sent back with findings to answer land here.',
    person: (w) => (w.checker ? `checker ${w.checker.name}` : null),
  },
  {
    key: 'recentlySigned',
    id: 'recently-signed',
    title: 'Recently signed',
    emptyTitle: 'Nothing signed lately',
    emptyText: 'Worksheets signed off in the last 30 days that you wrote, checked or signed.',
    person: (w) => (w.approver ? `signed by ${w.approver.name}` : null),
  },
];

/** `/o/:orgSlug`: the organization's home, what waits for the person in each of their roles. */
export function MyQueuePage() {
  const { membership, user } = useCurrentOrg();
  const queue = useQueue(membership.orgId);
  const waiting = queue.data
    ? queue.data.toCheck.length + queue.data.toSign.length + queue.data.returnedToMe.length
    : null;

  return (
    <div className="mx-auto flex w-full max-w-5xl flex-col gap-8">
      <title>{`My queue · ${membership.orgName} · Biasproof`}</title>
      <div>
        <p className="text-sm font-semibold text-ink-600">{membership.orgName}</p>
        <h1 className="text-3xl font-bold text-ink-900">My queue</h1>
        <p className="mt-2 text-ink-700">
          Welcome, {user.name}.
          {waiting
            ? ` ${waiting} ${waiting === 1 ? 'worksheet waits' : 'worksheets wait'} for you.`
            : ''}
        </p>
      </div>

      {queue.isError ? (
        <div className="flex flex-col items-start gap-3">
          <ErrorMessage>Your queue could not be loaded: {queue.error.message}</ErrorMessage>
          <Button variant="outline" onClick={() => void queue.refetch()}>
            Try again
          </Button>
        </div>
      ) : null}

      <div className="grid gap-6 md:grid-cols-[2fr_1fr]">
        <div className="flex flex-col gap-6">
          {waiting === 0 ? (
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
          ) : null}
          {queue.isError
            ? null
            : sections.map((section) => (
                <QueueSection
                  key={section.key}
                  copy={section}
                  items={queue.data?.[section.key]}
                  orgSlug={membership.orgSlug}
                />
              ))}
        </div>

        <Card aria-labelledby="my-roles-heading" className="self-start">
          <h2 id="my-roles-heading" className="mb-3 text-lg font-semibold text-ink-900">
            Your roles here
          </h2>
          <RoleList roles={membership.roles} />
        </Card>
      </div>
    </div>
  );
}
