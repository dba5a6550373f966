import { useCallback, useState } from 'react';
import { useParams } from 'react-router-dom';
import { ErrorMessage, LoadingMessage } from '@/components/ui/message.tsx';
import { TextLink } from '@/components/ui/text-link.tsx';
import { useWorksheet } from '@/features/worksheets/api/get-worksheet.ts';
import { StoredWorksheet } from '@/features/worksheets/components/page/stored-worksheet.tsx';
import type { WorksheetSlotsComponent } from '@/features/worksheets/components/page/worksheet-slots.ts';
import { ApiError } from '@/lib/api-client.ts';
import { orgPath, useCurrentOrg } from '@/lib/current-org.tsx';

/**
 * `/o/:orgSlug/worksheets/:worksheetId`: one saved worksheet, in the editor, with whatever the
 * app plugs in through `slots` (the review workflow).
 */
export function WorksheetPage({ slots }: { slots?: WorksheetSlotsComponent | undefined }) {
  const { worksheetId = '' } = useParams();
  const { membership } = useCurrentOrg();
  const worksheet = useWorksheet(membership.orgId, worksheetId);
  // Bumped to start the editor afresh from the server's version (after a conflict).
  const [generation, setGeneration] = useState(0);
  const { refetch } = worksheet;
  const reload = useCallback(async () => {
    await refetch();
    setGeneration((g) => g + 1);
  }, [refetch]);

  if (worksheet.isPending) {
    return (
      <div className="mx-auto w-full max-w-[96rem]">
        <LoadingMessage>Loading the worksheet…</LoadingMessage>
      </div>
    );
  }
  if (worksheet.isError) {
    const missing = worksheet.error instanceof ApiError && worksheet.error.status === 404;
    return (
      <div className="mx-auto flex w-full max-w-3xl flex-col gap-4">
        <title>{`Worksheet · ${membership.orgName} · Biasproof`}</title>
        <h1 className="text-3xl font-bold text-ink-900">
          {missing ? 'No such worksheet' : 'The worksheet could not be loaded'}
        </h1>
        <ErrorMessage>
          {missing
            ? `There is no worksheet at this address in ${membership.orgName}.`
            : worksheet.error.message}
        </ErrorMessage>
        <p>
          <TextLink to={orgPath(membership.orgSlug, 'worksheets')}>Back to the worksheets</TextLink>
        </p>
      </div>
    );
  }
  return (
    <StoredWorksheet
      key={`${worksheet.data.id}-${generation}`}
      worksheet={worksheet.data}
      onReload={reload}
      slots={slots}
    />
  );
}
