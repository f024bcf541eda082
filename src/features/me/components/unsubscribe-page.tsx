import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { EMAIL_TOPICS, type EmailTopic } from '@shared/schemas/publishing';
import { paths } from '@/config/paths';
import { Button } from '@/components/ui/button';
import { PageTitle } from '@/components/ui/page-title';
import { describeError } from '@/components/ui/states';
import { unsubscribe } from '../api/settings';

/**
 * The page an e-mail's unsubscribe link opens. It needs no sign-in: the link is signed. It asks
 * before acting, so a mail scanner that follows links does not unsubscribe anyone.
 */
export default function UnsubscribePage() {
  const [params] = useSearchParams();
  const user = params.get('user') ?? '';
  const topic = params.get('topic') ?? '';
  const sig = params.get('sig') ?? '';
  const [state, setState] = useState<{ kind: 'idle' | 'busy' | 'done' } | { kind: 'failed'; message: string }>({ kind: 'idle' });
  const label = EMAIL_TOPICS[topic as EmailTopic];

  return (
    <div className="flex max-w-2xl flex-col gap-4">
      <PageTitle title="Unsubscribe">Unsubscribe</PageTitle>
      {!label || !user || !sig ? (
        <p role="alert">This unsubscribe link is incomplete. Use the link from the message itself, or change your e-mail settings on <Link to={paths.myResults.getHref()}>your page</Link>.</p>
      ) : state.kind === 'done' ? (
        <p role="status">
          Done: you will no longer receive “{label}”. You can turn it on again on <Link to={paths.myResults.getHref()}>your page</Link>.
        </p>
      ) : (
        <>
          <p>Stop receiving “{label}” e-mail from Edgeledger?</p>
          {state.kind === 'failed' ? (
            <p role="alert" className="text-danger">
              {state.message}
            </p>
          ) : null}
          <div>
            <Button
              busy={state.kind === 'busy'}
              onClick={async () => {
                setState({ kind: 'busy' });
                try {
                  await unsubscribe({ user, topic, sig });
                  setState({ kind: 'done' });
                } catch (error) {
                  setState({ kind: 'failed', message: describeError(error) });
                }
              }}
            >
              Unsubscribe
            </Button>
          </div>
        </>
      )}
    </div>
  );
}
