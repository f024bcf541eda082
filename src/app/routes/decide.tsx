import { Link, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { PageTitle } from '@/components/ui/page-title';
import { ErrorState, Loading } from '@/components/ui/states';
import { useSteel } from '@/features/steels/api/get-steel';
import { useMethods } from '@/features/methods/api/get-methods';
import { DecisionView } from '@/features/compare/components/decision-view';

/** One steel's decision view: its options (abrasive material × grit band) and the difference between two. */
export default function DecideRoute() {
  const { slug = '' } = useParams();
  const steel = useSteel(slug);
  const methods = useMethods();
  if (steel.isPending || methods.isPending) return <Loading />;
  if (steel.isError) return <ErrorState error={steel.error} onRetry={() => steel.refetch()} />;
  if (methods.isError) return <ErrorState error={methods.error} onRetry={() => methods.refetch()} />;
  return (
    <article className="flex flex-col gap-6">
      <p className="-mb-4 text-sm">
        <Link to={paths.steel.getHref(slug)}>{steel.data.name}</Link>
      </p>
      <PageTitle title={`Choosing an abrasive for ${steel.data.name}`} lead="Which material and grit gave the keener, longer-lasting edge on this steel, by how much, and how sure the results are.">
        Choosing an abrasive for {steel.data.name}
      </PageTitle>
      <DecisionView steel={slug} steelName={steel.data.name} methods={methods.data.items.map((m) => ({ slug: m.slug, name: m.name }))} />
    </article>
  );
}
