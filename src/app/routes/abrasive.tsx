import { Link, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { PageTitle } from '@/components/ui/page-title';
import { FollowButton } from '@/features/me/components/follow-button';
import { FlagForm } from '@/features/curation/components/flag-form';
import { Loading } from '@/components/ui/states';
import { ReferencePageError } from '@/components/ui/reference-page-error';
import { useAbrasive } from '@/features/abrasives/api/get-abrasive';
import { AbrasiveDetail } from '@/features/abrasives/components/abrasive-detail';

/** One abrasive's reference page. */
export default function AbrasiveRoute() {
  const { slug = '' } = useParams();
  const page = useAbrasive(slug);
  if (page.isPending) return <Loading />;
  if (page.isError) {
    return <ReferencePageError error={page.error} onRetry={() => page.refetch()} what="abrasive" slug={slug} list={{ href: paths.abrasives.getHref(), label: 'All abrasives' }} />;
  }
  return (
    <article className="flex flex-col gap-6">
      <p className="-mb-4 text-sm">
        <Link to={paths.abrasives.getHref()}>Abrasives</Link>
      </p>
      <PageTitle title={page.data.name}>{page.data.name}</PageTitle>
      <div className="-mt-3 flex flex-wrap items-center gap-2">
        <FollowButton pageType="abrasive" slug={page.data.slug} name={page.data.name} />
        <FlagForm subjectType="abrasive" subject={page.data.slug} what="this page" />
      </div>
      <AbrasiveDetail abrasive={page.data} />
    </article>
  );
}
