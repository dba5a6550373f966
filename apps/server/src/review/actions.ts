import { availableActions, type AvailableActionsResponse } from '@biasproof/shared';
import type { OrgContext } from '../orgs/org-scope.ts';
import { findWorksheet } from '../worksheets/repository.ts';
import { noSuchWorksheet } from '../worksheets/worksheets.ts';
import { countOpenMajorFindings } from './repository.ts';
import { signatureMeanings } from './signature-repository.ts';
import { workflowView } from './transitions.ts';

/** `GET …/worksheets/:id/actions`: every workflow action for the caller, allowed or blocked with the reason. */
export async function getAvailableActions(
  org: OrgContext,
  id: string,
): Promise<AvailableActionsResponse> {
  return org.read(async (tx) => {
    const worksheet = await findWorksheet(tx, id);
    if (!worksheet) throw noSuchWorksheet();
    const openMajorFindings = await countOpenMajorFindings(tx, id);
    const items = availableActions(
      workflowView(worksheet),
      org.actor.userId,
      org.actor.roles,
      openMajorFindings,
    ).map((d) =>
      d.allowed
        ? { action: d.action, allowed: true, from: d.from, to: d.to }
        : { action: d.action, allowed: false, from: d.from, code: d.code, reason: d.reason },
    );
    return { items, openMajorFindings, signatureMeanings: await signatureMeanings(tx) };
  });
}
