import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';

/** What the last workflow step came to, told to the person after the page restarts. */
export interface StepNotice {
  tone: 'ok' | 'fault';
  text: string;
}

// A step restarts the worksheet page (its state, and so what may be edited, changed), which
// unmounts the action bar; the notice is kept in the query cache (per session, per worksheet)
// so the restarted bar can still say what happened.
function noticeKey(orgId: string, worksheetId: string) {
  return ['orgs', orgId, 'review-notice', worksheetId] as const;
}

export function useStepNotice(orgId: string, worksheetId: string) {
  const queryClient = useQueryClient();
  const key = noticeKey(orgId, worksheetId);
  const { data } = useQuery<StepNotice | null>({
    queryKey: key,
    queryFn: () => null,
    enabled: false,
    initialData: null,
    staleTime: Infinity,
  });
  const setNotice = useCallback(
    (notice: StepNotice | null) =>
      queryClient.setQueryData<StepNotice | null>(noticeKey(orgId, worksheetId), notice),
    [queryClient, orgId, worksheetId],
  );
  return [data, setNotice] as const;
}
