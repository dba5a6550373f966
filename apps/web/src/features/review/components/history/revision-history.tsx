import { useSearchParams } from 'react-router-dom';
import type { RevisionSummary } from '@biasproof/shared';
import { Card } from '@/components/ui/card.tsx';
import { ErrorMessage, LoadingMessage } from '@/components/ui/message.tsx';
import { SelectField } from '@/components/ui/select-field.tsx';
import { TextLink } from '@/components/ui/text-link.tsx';
import { useRevisionDiff } from '@/features/review/api/get-revision-diff.ts';
import { useRevisions } from '@/features/review/api/list-revisions.ts';
import { RevisionDiffView } from '@/features/review/components/history/revision-diff-view.tsx';
import { RecordDownloads } from '@/features/review/components/record-downloads.tsx';
import { shortHash, stateWords } from '@/features/review/components/review-format.ts';
import { SignatureManifest } from '@/features/review/components/signature-manifest.tsx';
import { orgPath, useCurrentOrg } from '@/lib/current-org.tsx';
import { useOrganization } from '@/lib/api/get-organization.ts';
import { formatInZone } from '@/lib/org-time.ts';

function RevisionCard({
  revision,
  timeZone,
  orgId,
  worksheetId,
}: {
  revision: RevisionSummary;
  timeZone: string;
  orgId: string;
  worksheetId: string;
}) {
  const id = `revision-${revision.letter}`;
  return (
    <li>
      <article
        aria-labelledby={id}
        className="flex flex-col gap-2 rounded-md border border-rule p-4"
      >
        <div className="flex flex-wrap items-baseline gap-x-4 gap-y-1">
          <h3 id={id} className="text-lg font-bold text-ink-900">
            Revision {revision.letter}
          </h3>
          <span className="rounded-full bg-paper px-2.5 py-0.5 text-xs font-semibold text-ink-700 ring-1 ring-inset ring-ink-300">
            {stateWords[revision.state] ?? revision.state}
          </span>
          <span className="text-sm text-ink-600">
            {revision.frozen ? 'frozen' : 'editable'} · {revision.findingCount}{' '}
            {revision.findingCount === 1 ? 'finding' : 'findings'}
          </span>
        </div>
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-sm">
          <dt className="text-ink-600">Started</dt>
          <dd>
            {revision.createdBy.name}, {formatInZone(revision.createdAt, timeZone)}
          </dd>
          <dt className="text-ink-600">Submitted</dt>
          <dd>{revision.submittedAt ? formatInZone(revision.submittedAt, timeZone) : 'not yet'}</dd>
          <dt className="text-ink-600">Content hash</dt>
          <dd className="font-mono text-xs" title={`SHA-256 ${revision.contentHash}`}>
            {shortHash(revision.contentHash)}… (engine {revision.engineVersion})
          </dd>
        </dl>
        {revision.signatures.map((s) => (
          <SignatureManifest key={s.id} signature={s} timeZone={timeZone} />
        ))}
        <RecordDownloads
          orgId={orgId}
          worksheetId={worksheetId}
          letter={revision.letter}
          signed={revision.signatures.length > 0}
        />
      </article>
    </li>
  );
}

/**
 * `/o/:orgSlug/worksheets/:worksheetId/history`: every revision with who, when, state, hash and
 * signatures; two chosen revisions (kept in the address) compared number by number.
 */
export function RevisionHistory({
  worksheetId,
  title,
}: {
  worksheetId: string;
  /** The worksheet's title, once known. */
  title: string | undefined;
}) {
  const { membership } = useCurrentOrg();
  const orgId = membership.orgId;
  const timeZone = useOrganization(orgId).data?.timezone ?? 'UTC';
  const revisions = useRevisions(orgId, worksheetId);
  const [params, setParams] = useSearchParams();
  const letters = revisions.data?.items.map((r) => r.letter) ?? [];
  const pick = (key: 'from' | 'to', fallback: string | undefined) => {
    const chosen = params.get(key);
    return chosen && letters.includes(chosen) ? chosen : (fallback ?? null);
  };
  const from = pick('from', letters.at(-2));
  const to = pick('to', letters.at(-1));
  const diff = useRevisionDiff(orgId, worksheetId, from, to);
  const choose = (key: 'from' | 'to', letter: string) =>
    setParams(
      (p) => {
        const next = new URLSearchParams(p);
        next.set(key, letter);
        return next;
      },
      { replace: true },
    );

  const name = title ?? 'worksheet';
  return (
    <div className="mx-auto flex w-full max-w-5xl flex-col gap-6">
      <title>{`History · ${name} · ${membership.orgName} · Biasproof`}</title>
      <div className="flex flex-col gap-1">
        <TextLink to={orgPath(membership.orgSlug, `worksheets/${worksheetId}`)}>
          Back to the worksheet
        </TextLink>
        <h1 className="text-3xl font-bold text-ink-900">History of {title ?? 'the worksheet'}</h1>
      </div>

      {revisions.isPending ? <LoadingMessage>Loading the revisions…</LoadingMessage> : null}
      {revisions.isError ? (
        <ErrorMessage>The history could not be loaded: {revisions.error.message}</ErrorMessage>
      ) : null}

      {revisions.data ? (
        <Card aria-labelledby="revisions-heading" className="flex flex-col gap-4">
          <h2 id="revisions-heading" className="text-lg font-semibold text-ink-900">
            Revisions ({revisions.data.total})
          </h2>
          <ol className="flex flex-col gap-3">
            {revisions.data.items.map((r) => (
              <RevisionCard
                key={r.letter}
                revision={r}
                timeZone={timeZone}
                orgId={orgId}
                worksheetId={worksheetId}
              />
            ))}
          </ol>
        </Card>
      ) : null}

      {letters.length > 1 ? (
        <Card aria-labelledby="compare-heading" className="flex flex-col gap-4">
          <h2 id="compare-heading" className="text-lg font-semibold text-ink-900">
            Compare two revisions
          </h2>
          <div className="flex flex-wrap gap-4">
            {(['from', 'to'] as const).map((key) => (
              <SelectField
                key={key}
                label={key === 'from' ? 'From revision' : 'To revision'}
                value={(key === 'from' ? from : to) ?? ''}
                onChange={(event) => choose(key, event.target.value)}
              >
                {letters.map((l) => (
                  <option key={l} value={l}>
                    {l}
                  </option>
                ))}
              </SelectField>
            ))}
          </div>
          {from === to ? (
            <p className="text-sm text-ink-600">Choose two different revisions to compare.</p>
          ) : null}
          {diff.isFetching && !diff.data ? (
            <LoadingMessage>Comparing revisions…</LoadingMessage>
          ) : null}
          {diff.isError ? (
            <ErrorMessage>The comparison failed: {diff.error.message}</ErrorMessage>
          ) : null}
          {diff.data && from !== to ? <RevisionDiffView diff={diff.data} /> : null}
        </Card>
      ) : revisions.data ? (
        <p className="text-ink-700">
          There is one revision so far; a comparison needs a second one.
        </p>
      ) : null}
    </div>
  );
}
