import { PageTitle } from '@/components/ui/page-title';
import { Empty, ErrorState, Loading } from '@/components/ui/states';
import { useMethods } from '@/features/methods/api/get-methods';
import { MethodsTable } from '@/features/methods/components/methods-table';

/** Methods: the list of reference pages. */
export default function MethodsRoute() {
  const list = useMethods();
  return (
    <div className="flex flex-col gap-6">
      <PageTitle title="Methods" lead="Written test protocols. Every result names the method, and version, it was measured with.">
        Methods
      </PageTitle>
      {list.isPending ? (
        <Loading />
      ) : list.isError ? (
        <ErrorState error={list.error} onRetry={() => list.refetch()} />
      ) : list.data.items.length === 0 ? (
        <Empty title="No methods written yet" />
      ) : (
        <MethodsTable methods={list.data.items} />
      )}
    </div>
  );
}
