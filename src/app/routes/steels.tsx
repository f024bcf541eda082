import { PageTitle } from '@/components/ui/page-title';
import { Empty, ErrorState, Loading } from '@/components/ui/states';
import { useSteels } from '@/features/steels/api/get-steels';
import { SteelsTable } from '@/features/steels/components/steels-table';

/** Steels: the list of reference pages. */
export default function SteelsRoute() {
  const list = useSteels();
  return (
    <div className="flex flex-col gap-6">
      <PageTitle title="Steels" lead="Standard steel grades with their designations in each standard, composition and typical hardness.">
        Steels
      </PageTitle>
      {list.isPending ? (
        <Loading />
      ) : list.isError ? (
        <ErrorState error={list.error} onRetry={() => list.refetch()} />
      ) : list.data.items.length === 0 ? (
        <Empty title="No steel pages yet" />
      ) : (
        <SteelsTable steels={list.data.items} />
      )}
    </div>
  );
}
