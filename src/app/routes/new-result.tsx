import { useNavigate } from 'react-router-dom';
import { paths } from '@/config/paths';
import { SignInRequired } from '@/lib/authorization';
import { PageTitle } from '@/components/ui/page-title';
import { ErrorState, Loading } from '@/components/ui/states';
import { useAbrasives } from '@/features/abrasives/api/get-abrasives';
import { useMethods } from '@/features/methods/api/get-methods';
import { useSteels } from '@/features/steels/api/get-steels';
import { ResultForm } from '@/features/results/components/result-form';
import { checkDuplicates } from '@/features/me/api/check-duplicates';

function NewResultForm() {
  const navigate = useNavigate();
  const steels = useSteels();
  const abrasives = useAbrasives();
  const methods = useMethods();
  const failed = [steels, abrasives, methods].find((q) => q.isError);
  if (failed) return <ErrorState error={failed.error} onRetry={() => void Promise.all([steels.refetch(), abrasives.refetch(), methods.refetch()])} />;
  if (!steels.data || !abrasives.data || !methods.data) return <Loading label="Loading steels, abrasives and methods…" />;
  return (
    <ResultForm
      steels={steels.data.items}
      abrasives={abrasives.data.items}
      methods={methods.data.items}
      onCreated={(result) => navigate(paths.result.getHref(result.id))}
      onDraftCreated={(result) => navigate(paths.editResult.getHref(result.id), { state: { draftSaved: true } })}
      findDuplicates={checkDuplicates}
    />
  );
}

/** New result (signed in): the structured form for one measured edge. */
export default function NewResultRoute() {
  return (
    <div className="flex max-w-4xl flex-col gap-6">
      <PageTitle
        title="New result"
        lead="One measured edge: the steel, how it was sharpened, and what the tester read. A moderator reviews it before it is published."
      >
        Post a result
      </PageTitle>
      <SignInRequired what="post a result">
        <NewResultForm />
      </SignInRequired>
    </div>
  );
}
