import { PageTitle } from '@/components/ui/page-title';
import { ListStates } from '@/components/ui/states';
import { NewPageLink } from '@/features/wiki/components/new-page-link';
import { useAbrasives } from '@/features/abrasives/api/get-abrasives';
import { AbrasivesTable } from '@/features/abrasives/components/abrasives-table';

/** Abrasives: the list of reference pages. */
export default function AbrasivesRoute() {
  const list = useAbrasives();
  return (
    <div className="flex flex-col gap-6">
      <PageTitle title="Abrasives" lead="Generic abrasive types: material, bond, form, grit, size, and whether they wear.">
        Abrasives
      </PageTitle>
      <NewPageLink section="abrasives" />
      <ListStates query={list} emptyTitle="No abrasive pages yet">
        {(items) => <AbrasivesTable abrasives={items} />}
      </ListStates>
    </div>
  );
}
