import { useNavigate, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { SignInRequired } from '@/lib/authorization';
import { PageTitle } from '@/components/ui/page-title';
import { ErrorState, Loading } from '@/components/ui/states';
import { useAbrasives } from '@/features/abrasives/api/get-abrasives';
import { useMethods } from '@/features/methods/api/get-methods';
import { useSteels } from '@/features/steels/api/get-steels';
import { useResult } from '@/features/results/api/get-result';
import { ResultForm } from '@/features/results/components/result-form';
import type { ResultInput } from '@shared/schemas/result';
import type { Result } from '@/types/api';

/** The stored input of a result, as the form and PUT /api/results/:id take it. */
function inputOf(r: Result): ResultInput {
  return {
    steel: r.steel,
    hardness: r.hardness,
    ...(r.heatTreatment ? { heatTreatment: r.heatTreatment } : {}),
    abrasive: r.abrasive,
    ...(r.grit ? { grit: { grade: r.grit.grade, ...(r.grit.standard ? { standard: r.grit.standard } : {}) } } : {}),
    edgeAngle: r.edgeAngle,
    sharpness: r.sharpness,
    ...(r.retention ? { retention: r.retention } : {}),
    ...(r.notes ? { notes: r.notes as ResultInput['notes'] } : {}),
  };
}

function EditForm({ id }: { id: number }) {
  const navigate = useNavigate();
  const result = useResult(id);
  const steels = useSteels();
  const abrasives = useAbrasives();
  const methods = useMethods();
  const failed = [result, steels, abrasives, methods].find((q) => q.isError);
  if (failed) return <ErrorState error={failed.error} onRetry={() => void Promise.all([result.refetch(), steels.refetch(), abrasives.refetch(), methods.refetch()])} />;
  if (!result.data || !steels.data || !abrasives.data || !methods.data) return <Loading label="Loading the result and its pages…" />;
  const r = result.data;
  if (!r.can.edit) return <ErrorState title="This result cannot be edited" error={new Error('Only its author edits a result, and not once it was declined or withdrawn.')} />;
  return (
    <ResultForm
      key={`${r.id}:${r.updatedAt}`}
      steels={steels.data.items}
      abrasives={abrasives.data.items}
      methods={methods.data.items}
      editing={{ id: r.id, status: r.status, input: inputOf(r) }}
      onCreated={(created) => navigate(paths.result.getHref(created.id))}
      onEdited={(edit) => {
        if (edit.result.status !== 'draft') navigate(paths.result.getHref(edit.result.id), { state: { edited: edit.outcome, revision: edit.revision.number } });
      }}
    />
  );
}

/** The author edits their result: resubmits a returned one, corrects a published one, continues a draft. */
export default function EditResultRoute() {
  const { id } = useParams();
  const resultId = Number(id);
  if (!Number.isInteger(resultId) || resultId <= 0) return <ErrorState title="No such result" error={new Error(`“${id}” is not a result number.`)} />;
  return (
    <div className="flex max-w-4xl flex-col gap-6">
      <PageTitle title={`Edit result ${resultId}`} lead="Change what you entered. Every version is kept with the result.">
        Edit result {resultId}
      </PageTitle>
      <SignInRequired what="edit a result">
        <EditForm id={resultId} />
      </SignInRequired>
    </div>
  );
}
