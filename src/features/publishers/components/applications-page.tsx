import { useId, useState } from 'react';
import { ApiError } from '@/lib/api-client';
import { useCan } from '@/lib/auth';
import { SignInRequired } from '@/lib/authorization';
import { formatDate } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { Field, Textarea } from '@/components/ui/field';
import { PageTitle } from '@/components/ui/page-title';
import { describeError, Empty, ErrorState, Loading } from '@/components/ui/states';
import { applicationDecisionSchema, useApplications, useDecideApplication, usePublishingSettings, useUpdatePublishingSettings, type Application } from '../api/applications';

function Decision({ application }: { application: Application }) {
  const noteId = useId();
  const [note, setNote] = useState('');
  const [error, setError] = useState<string | undefined>();
  const decide = useDecideApplication();
  const send = (decision: 'approve' | 'decline') => {
    const parsed = applicationDecisionSchema.safeParse({ decision, ...(note.trim() ? { note: note.trim() } : {}) });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message);
    setError(undefined);
    decide.mutate({ id: application.id, input: parsed.data });
  };
  return (
    <li className="flex flex-col gap-2 px-4 py-3">
      <p>
        <strong>{application.workshop}</strong> from {application.applicant?.displayName} (@{application.applicant?.handle}), {formatDate(application.createdAt)}
      </p>
      <p className="text-muted">{application.instruments}</p>
      <p>
        <a href={application.link} rel="nofollow noopener noreferrer" target="_blank">
          {application.link}
        </a>
      </p>
      <Field id={noteId} label="Note to the applicant" hint="Needed to decline." error={error}>
        <Textarea id={noteId} className="min-h-12" value={note} maxLength={2000} onChange={(e) => setNote(e.target.value)} />
      </Field>
      {decide.isError ? (
        <p role="alert" className="text-danger">
          {decide.error instanceof ApiError && decide.error.status === 409 ? 'Another admin decided this application first.' : describeError(decide.error)}
        </p>
      ) : null}
      <div className="flex gap-2">
        <Button size="sm" busy={decide.isPending} onClick={() => send('approve')}>
          Approve
        </Button>
        <Button size="sm" variant="danger" disabled={decide.isPending} onClick={() => send('decline')}>
          Decline
        </Button>
      </div>
    </li>
  );
}

function Settings() {
  const settings = usePublishingSettings();
  const update = useUpdatePublishingSettings();
  if (!settings.data) return null;
  return (
    <section aria-labelledby="settings" className="flex flex-col gap-2">
      <h2 id="settings" className="text-xl font-semibold">
        Publishing setting
      </h2>
      <label className="flex items-center gap-2">
        <input type="checkbox" checked={settings.data.trustPublisherImports} disabled={update.isPending} onChange={(e) => update.mutate({ trustPublisherImports: e.target.checked })} />
        Publish publishers’ imports at once, without review
      </label>
      <p className="text-sm text-muted">Off: every imported result waits on the review desk (moderators can approve a whole import at once).</p>
    </section>
  );
}

function Applications() {
  const pending = useApplications('pending');
  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="pending-applications" className="flex flex-col gap-2">
        <h2 id="pending-applications" className="text-xl font-semibold">
          Waiting for a decision
        </h2>
        {pending.isPending ? (
          <Loading />
        ) : pending.isError ? (
          <ErrorState error={pending.error} onRetry={() => pending.refetch()} />
        ) : pending.data.items.length ? (
          <ul className="divide-y divide-rule rounded-md border border-rule bg-panel">
            {pending.data.items.map((a) => (
              <Decision key={a.id} application={a} />
            ))}
          </ul>
        ) : (
          <Empty title="No applications waiting" />
        )}
      </section>
      <Settings />
    </div>
  );
}

/** Publisher applications and the publishing setting (admins). */
export default function ApplicationsPage() {
  const mayDecide = useCan('decide:publisher-application');
  return (
    <div className="flex flex-col gap-6">
      <PageTitle title="Publisher applications" lead="Workshops and labs that ask to publish in bulk. Approving one gives the member the publisher badge, bulk import and API tokens.">
        Publisher applications
      </PageTitle>
      <SignInRequired what="decide publisher applications" action="decide:publisher-application">
        {mayDecide ? <Applications /> : null}
      </SignInRequired>
    </div>
  );
}
