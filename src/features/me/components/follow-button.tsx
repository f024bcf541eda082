import type { FollowablePage } from '@shared/schemas/publishing';
import { useUser } from '@/lib/auth';
import { Button } from '@/components/ui/button';
import { useMe } from '../api/get-me';
import { useFollow } from '../api/settings';

/** Follow or stop following a steel or abrasive page (weekly digest of new results); signed-in members only. */
export function FollowButton({ pageType, slug, name }: { pageType: FollowablePage; slug: string; name: string }) {
  const user = useUser();
  const me = useMe({ enabled: !!user });
  const follow = useFollow();
  if (!user || !me.data) return null;
  const following = me.data.following.some((f) => f.pageType === pageType && f.slug === slug);
  return (
    <Button
      variant="secondary"
      size="sm"
      aria-pressed={following}
      busy={follow.isPending}
      onClick={() => follow.mutate({ pageType, slug, follow: !following })}
      title={following ? `Stop the weekly digest for ${name}` : `Get a weekly e-mail of new results on ${name}`}
    >
      {following ? 'Following' : 'Follow'}
    </Button>
  );
}
