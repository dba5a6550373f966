import { StatusBadge } from '@/components/ui/status-badge.tsx';
import { useAuditChain } from '@/features/audit/api/verify-audit-chain.ts';

/** Whether the organization's hash chain verifies: intact, or broken at the first bad event. */
export function ChainBadge({ orgId }: { orgId: string }) {
  const chain = useAuditChain(orgId, true);
  if (chain.isPending) {
    return (
      <StatusBadge tone="pending" label="Audit chain: checking">
        Checking the chain…
      </StatusBadge>
    );
  }
  if (chain.isError) {
    return (
      <StatusBadge tone="fault" label="Audit chain: not checked" title={chain.error.message}>
        Chain not checked: {chain.error.message}
      </StatusBadge>
    );
  }
  const { ok, events, firstBadEventId } = chain.data;
  return ok ? (
    <StatusBadge
      tone="ok"
      label={`Audit chain: intact, ${events} events`}
      title="Every event's hash follows from the one before: nothing was altered or removed."
    >
      Chain intact · {events} events verified
    </StatusBadge>
  ) : (
    <StatusBadge
      tone="fault"
      label={`Audit chain: broken at event ${firstBadEventId ?? 'unknown'}`}
      title="An event's stored hash does not follow from the events before it."
    >
      Chain broken at event {firstBadEventId ?? '(unknown)'}
    </StatusBadge>
  );
}
