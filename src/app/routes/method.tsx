import { Link, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { PageTitle } from '@/components/ui/page-title';
import { Loading } from '@/components/ui/states';
import { ReferencePageError } from '@/components/ui/reference-page-error';
import { useMethod } from '@/features/methods/api/get-method';
import { MethodDetail } from '@/features/methods/components/method-detail';

/** One method's reference page. */
export default function MethodRoute() {
  const { slug = '' } = useParams();
  const page = useMethod(slug);
  if (page.isPending) return <Loading />;
  if (page.isError) {
    return <ReferencePageError error={page.error} onRetry={() => page.refetch()} what="method" slug={slug} list={{ href: paths.methods.getHref(), label: 'All methods' }} />;
  }
  return (
    <article className="flex flex-col gap-6">
      <p className="-mb-4 text-sm">
        <Link to={paths.methods.getHref()}>Methods</Link>
      </p>
      <PageTitle title={page.data.name}>{page.data.name}</PageTitle>
      <MethodDetail method={page.data} />
    </article>
  );
}
