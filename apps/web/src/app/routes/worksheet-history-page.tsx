import { useParams } from 'react-router-dom';
import { RevisionHistory } from '@/features/review/components/history/revision-history.tsx';
import { useWorksheet } from '@/features/worksheets/api/get-worksheet.ts';
import { useCurrentOrg } from '@/lib/current-org.tsx';

/** `/o/:orgSlug/worksheets/:worksheetId/history`: the review's history under the worksheet's title. */
export function WorksheetHistoryPage() {
  const { worksheetId = '' } = useParams();
  const { membership } = useCurrentOrg();
  const worksheet = useWorksheet(membership.orgId, worksheetId);
  return <RevisionHistory worksheetId={worksheetId} title={worksheet.data?.title} />;
}
