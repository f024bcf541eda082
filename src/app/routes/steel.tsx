import { Link, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { PageTitle } from '@/components/ui/page-title';
import { FollowButton } from '@/features/me/components/follow-button';
import { FlagForm } from '@/features/curation/components/flag-form';
import { Loading } from '@/components/ui/states';
import { ReferencePageError } from '@/components/ui/reference-page-error';
import { useSteel } from '@/features/steels/api/get-steel';
import { SteelDetail } from '@/features/steels/components/steel-detail';

/** One steel's reference page. */
export default function SteelRoute() {
  const { slug = '' } = useParams();
  const page = useSteel(slug);
  if (page.isPending) return <Loading />;
  if (page.isError) {
    return <ReferencePageError error={page.error} onRetry={() => page.refetch()} what="steel" slug={slug} list={{ href: paths.steels.getHref(), label: 'All steels' }} />;
  }
  return (
    <article className="flex flex-col gap-6">
      <p className="-mb-4 text-sm">
        <Link to={paths.steels.getHref()}>Steels</Link>
      </p>
      <PageTitle title={page.data.name}>{page.data.name}</PageTitle>
      <div className="-mt-3 flex flex-wrap items-center gap-2">
        <FollowButton pageType="steel" slug={page.data.slug} name={page.data.name} />
        <FlagForm subjectType="steel" subject={page.data.slug} what="this page" />
        <Link to={paths.decide.getHref(page.data.slug)} className="font-semibold">
          Choose an abrasive for {page.data.name}
        </Link>
      </div>
      <SteelDetail steel={page.data} />
    </article>
  );
}
