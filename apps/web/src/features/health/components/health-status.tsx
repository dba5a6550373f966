import { StatusBadge, type StatusTone } from '@/components/ui/status-badge.tsx';
import { useHealth } from '@/features/health/api/get-health.ts';

interface StatusView {
  tone: StatusTone;
  text: string;
  title?: string;
}

function useStatusView(): StatusView {
  const { data, isError } = useHealth();
  // A failed re-check wins over an older answer: a stale "Database ok" would mislead.
  if (isError) return { tone: 'fault', text: 'Server unreachable' };
  if (!data) return { tone: 'pending', text: 'Checking…' };
  return data.db === 'ok'
    ? { tone: 'ok', text: 'Database ok', title: `Server ${data.version}` }
    : {
        tone: 'fault',
        text: 'Database down',
        title: `Server ${data.version} cannot reach its database`,
      };
}

/** The header's server and database indicator, fed by GET /api/health. */
export function HealthStatus() {
  const view = useStatusView();
  return (
    <StatusBadge tone={view.tone} label={`System status: ${view.text}`} title={view.title}>
      {view.text}
    </StatusBadge>
  );
}
