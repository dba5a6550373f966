/**
 * Every cached review answer of one worksheet (actions, findings, signatures, revisions, diffs,
 * attachments): a workflow step or a finding change invalidates them together.
 */
export function worksheetReviewKey(orgId: string, worksheetId: string) {
  return ['orgs', orgId, 'review', worksheetId] as const;
}

/** `/orgs/:orgId/worksheets/:id` as the review endpoints start. */
export function worksheetApiPath(orgId: string, worksheetId: string): string {
  return `/orgs/${encodeURIComponent(orgId)}/worksheets/${encodeURIComponent(worksheetId)}`;
}
