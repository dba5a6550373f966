import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useMemo, type ReactNode } from 'react';
import { useMembers } from '@/features/members/api/list-members.ts';
import { allWorksheetListsKey } from '@/features/worksheets/api/list-worksheets.ts';
import type {
  WorksheetSlotContext,
  WorksheetSlots,
} from '@/features/worksheets/components/page/worksheet-slots.ts';
import { queueQueryOptions } from '@/features/queue/api/get-queue.ts';
import { ReviewSlots } from '@/features/review/components/review-slots.tsx';
import { useCurrentOrg } from '@/lib/current-org.tsx';

/**
 * The review plugged into the worksheet page's slots. The two features do not know each other:
 * this module is where they meet: it hands the review the members to assign, and after a
 * workflow step refreshes what other features list (the queue, the worksheet tables).
 */
export function WorksheetReview({
  context,
  children,
}: {
  context: WorksheetSlotContext;
  children: (slots: WorksheetSlots) => ReactNode;
}) {
  const queryClient = useQueryClient();
  const { orgId } = useCurrentOrg().membership;
  const onStep = useCallback(
    () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: queueQueryOptions(orgId).queryKey }),
        queryClient.invalidateQueries({ queryKey: allWorksheetListsKey(orgId) }),
      ]),
    [queryClient, orgId],
  );
  const members = useMembers(orgId);
  const people = useMemo(
    () =>
      (members.data?.items ?? [])
        .filter((m) => !m.disabled)
        .map((m) => ({ id: m.userId, name: m.name, roles: m.roles })),
    [members.data],
  );
  return (
    <ReviewSlots context={context} onStep={onStep} people={people}>
      {children}
    </ReviewSlots>
  );
}
