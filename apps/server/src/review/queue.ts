import type { QueueResponse } from '@biasproof/shared';
import type { OrgContext } from '../orgs/org-scope.ts';
import { queryWorksheetItems } from '../worksheets/repository.ts';

/** Most worksheets each list of the queue shows. */
const QUEUE_LIMIT = 20;

// When the current revision was signed (its latest signature), for "recently signed".
const signedAt = `(SELECT max(s.signed_at) FROM signatures s
   WHERE s.org_id = w.org_id AND s.worksheet_id = w.id AND s.revision_letter = w.current_revision)`;

/**
 * `GET /api/orgs/:orgId/queue`: the caller's work, by assignment rather than by role: in check
 * with them as checker, checked with them as approver, returned to them as author, and what was
 * signed off in the last 30 days with them as author, checker (assigned or who accepted) or approver.
 */
export async function getQueue(org: OrgContext): Promise<QueueResponse> {
  const me = org.actor.userId;
  return org.read(async (tx) => {
    const list = (where: string, orderBy = 'w.updated_at DESC') =>
      queryWorksheetItems(tx, { where, bind: [me], orderBy, limit: QUEUE_LIMIT });
    return {
      toCheck: await list(`w.state = 'in_check' AND w.checker_user_id = $2`),
      toSign: await list(`w.state = 'checked' AND w.approver_user_id = $2`),
      returnedToMe: await list(`w.state = 'returned' AND w.author_user_id = $2`),
      recentlySigned: await list(
        `w.state = 'signed_off' AND $2 IN (w.author_user_id, w.checker_user_id,
           w.checked_by_user_id, w.approver_user_id)
         AND ${signedAt} > now() - interval '30 days'`,
        `${signedAt} DESC`,
      ),
    };
  });
}
