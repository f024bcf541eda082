import { useState } from 'react';
import { useCan } from '@/lib/auth';
import { SignInRequired } from '@/lib/authorization';
import { formatDateTime } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { PageTitle } from '@/components/ui/page-title';
import { Empty, ErrorState, Loading } from '@/components/ui/states';
import { useDevMail, type CaughtMail } from '../api/get-dev-mail';

function Message({ mail }: { mail: CaughtMail }) {
  const [part, setPart] = useState<'text' | 'html'>('text');
  return (
    <li className="flex flex-col gap-2 px-4 py-3">
      <p>
        <strong>{mail.subject}</strong> <span className="text-sm text-muted">to {mail.to} · {formatDateTime(mail.date)}</span>
      </p>
      <div className="flex gap-2" role="group" aria-label="Part to show">
        <Button size="sm" variant={part === 'text' ? 'primary' : 'secondary'} aria-pressed={part === 'text'} onClick={() => setPart('text')}>
          Plain text
        </Button>
        <Button size="sm" variant={part === 'html' ? 'primary' : 'secondary'} aria-pressed={part === 'html'} onClick={() => setPart('html')}>
          HTML
        </Button>
      </div>
      {part === 'text' ? (
        <pre className="overflow-x-auto whitespace-pre-wrap rounded border border-rule bg-paper p-3 text-sm">{mail.text}</pre>
      ) : (
        // The HTML part in a sandboxed frame: no scripts, no same-origin access.
        <iframe title={`HTML part of “${mail.subject}”`} sandbox="" srcDoc={mail.html} className="h-72 w-full rounded border border-rule bg-white" />
      )}
    </li>
  );
}

/** The local mail catcher's messages (admins, development only). */
export default function DevMailPage() {
  const mayRead = useCan('read:dev-mail');
  const mail = useDevMail({ enabled: mayRead });
  return (
    <div className="flex flex-col gap-6">
      <PageTitle title="Mail catcher" lead="Outside production, e-mail goes to a local SMTP catcher instead of anyone’s inbox. These are the messages it holds, newest first.">
        Mail catcher
      </PageTitle>
      <SignInRequired what="read the caught mail" action="read:dev-mail">
        {!mayRead ? null : mail.isPending ? (
          <Loading />
        ) : mail.isError ? (
          <ErrorState error={mail.error} onRetry={() => mail.refetch()} />
        ) : mail.data.length ? (
          <ul className="divide-y divide-rule rounded-md border border-rule bg-panel">
            {mail.data.map((m, i) => (
              <Message key={`${m.date}-${i}`} mail={m} />
            ))}
          </ul>
        ) : (
          <Empty title="No mail yet" />
        )}
      </SignInRequired>
    </div>
  );
}
