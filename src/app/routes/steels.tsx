import { PageTitle } from '@/components/ui/page-title';
import { ListStates } from '@/components/ui/states';
import { NewPageLink } from '@/features/wiki/components/new-page-link';
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
      <NewPageLink section="steels" />
      <ListStates query={list} emptyTitle="No steel pages yet">
        {(items) => <SteelsTable steels={items} />}
      </ListStates>
    </div>
  );
}
