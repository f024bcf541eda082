import { PageTitle } from '@/components/ui/page-title';
import { ListStates } from '@/components/ui/states';
import { NewPageLink } from '@/features/wiki/components/new-page-link';
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
      <NewPageLink section="methods" />
      <ListStates query={list} emptyTitle="No methods written yet">
        {(items) => <MethodsTable methods={items} />}
      </ListStates>
    </div>
  );
}
