import { EMAIL_TOPICS, type EmailTopic } from '@shared/schemas/publishing';
import { describeError } from '@/components/ui/states';
import { useUpdateNotifications } from '../api/settings';

/** Check boxes for each kind of e-mail; each change is saved at once. */
export function NotificationSettings({ settings, hasEmail }: { settings: Record<EmailTopic, boolean>; hasEmail: boolean }) {
  const update = useUpdateNotifications();
  return (
    <section aria-labelledby="e-mail-heading" id="e-mail" className="flex flex-col gap-2">
      <h2 id="e-mail-heading" className="text-xl font-semibold">
        E-mail
      </h2>
      {!hasEmail ? <p className="text-muted">Your sign-in provider gave us no e-mail address, so nothing is sent.</p> : null}
      <fieldset className="flex flex-col gap-1.5 rounded-md border border-rule bg-panel px-4 py-3" aria-labelledby="e-mail-heading">
        {(Object.keys(EMAIL_TOPICS) as EmailTopic[]).map((topic) => (
          <label key={topic} className="flex items-center gap-2">
            <input type="checkbox" checked={settings[topic]} disabled={update.isPending} onChange={(e) => update.mutate({ [topic]: e.target.checked })} />
            {EMAIL_TOPICS[topic]}
          </label>
        ))}
      </fieldset>
      {update.isError ? (
        <p role="alert" className="text-danger">
          {describeError(update.error)}
        </p>
      ) : null}
      <p className="text-sm text-muted">Every message also carries a link that turns its kind off without signing in.</p>
    </section>
  );
}
