import { STATUS_LABELS } from '@shared/vocabulary';
import type { ResultStatus } from '@shared/schemas/result';
import { Badge, type BadgeTone } from '@/components/ui/badge';

const tones: Record<ResultStatus, BadgeTone> = {
  draft: 'neutral',
  pending: 'caution',
  approved: 'accent',
  returned: 'caution',
  rejected: 'danger',
  retracted: 'neutral',
};

/** A result's state in plain words ("Awaiting review", "Published", …). */
export function StatusBadge({ status }: { status: ResultStatus }) {
  return <Badge tone={tones[status] ?? 'neutral'}>{STATUS_LABELS[status] ?? status}</Badge>;
}
