import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { buttonClasses } from '@/components/ui/button';
import type { Result } from '@/types/api';

const WORDS: Partial<Record<Result['status'], { label: string; lead: string }>> = {
  returned: { label: 'Edit and resubmit', lead: 'Change what the reviewer asked for; the result goes back on the review desk.' },
  approved: { label: 'Correct', lead: 'Send a correction: the published version stays until a moderator approves it.' },
  pending: { label: 'Edit', lead: 'Still awaiting review: your changes replace what the reviewer will see.' },
  draft: { label: 'Continue the draft', lead: 'A draft is yours alone until you submit it for review.' },
};

/** The author's way to change their result, named for its state. */
export function EditResultAction({ result }: { result: Result }) {
  const words = WORDS[result.status];
  if (!result.can.edit || !words) return null;
  return (
    <div className="flex flex-wrap items-center gap-3">
      <Link to={paths.editResult.getHref(result.id)} className={buttonClasses('primary')}>
        {words.label}
      </Link>
      <p className="min-w-0 flex-1 text-sm text-muted">{words.lead}</p>
    </div>
  );
}
