import { useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import { controlA11y, Field, Input, Textarea } from '@/components/ui/field';
import { describeError } from '@/components/ui/states';
import { formatDate } from '@/lib/format';
import type { PublisherApplicationInfo } from '../types';
import { publisherApplicationSchema, useApplyForPublisher, type PublisherApplicationInput } from '../api/settings';

type Errors = Partial<Record<keyof PublisherApplicationInput, string>>;

/** The publisher application: its state when there is one, the form when a member may apply. */
export function PublisherApplication({ application, mayApply }: { application: PublisherApplicationInfo | null; mayApply: boolean }) {
  const ids = { workshop: useId(), instruments: useId(), link: useId() };
  const [values, setValues] = useState<PublisherApplicationInput>({ workshop: '', instruments: '', link: '' });
  const [errors, setErrors] = useState<Errors>({});
  const apply = useApplyForPublisher();
  if (!application && !mayApply) return null;

  return (
    <section aria-labelledby="publisher" className="flex flex-col gap-3">
      <h2 id="publisher" className="text-xl font-semibold">
        Publisher
      </h2>
      {application ? (
        <p className="rounded-md border border-rule bg-panel px-4 py-3">
          Your application for <strong>{application.workshop}</strong> ({formatDate(application.createdAt)}):{' '}
          {application.status === 'pending' ? 'waiting for an admin’s decision.' : application.status === 'approved' ? 'approved.' : `declined${application.decision?.note ? `: “${application.decision.note}”` : '.'}`}
        </p>
      ) : null}
      {mayApply ? (
        <form
          aria-label="Apply to become a publisher"
          className="flex flex-col gap-3 rounded-md border border-rule bg-panel p-4"
          onSubmit={(e) => {
            e.preventDefault();
            const parsed = publisherApplicationSchema.safeParse(values);
            if (!parsed.success) {
              const next: Errors = {};
              for (const i of parsed.error.issues) next[i.path[0] as keyof Errors] ??= i.message;
              return setErrors(next);
            }
            setErrors({});
            apply.mutate(parsed.data);
          }}
        >
          <p className="text-muted">Publishers are verified workshops and labs: they import results in bulk, use API tokens and carry a badge on every result.</p>
          <Field id={ids.workshop} label="Workshop or lab" error={errors.workshop}>
            <Input {...controlA11y(ids.workshop, { error: errors.workshop })} value={values.workshop} maxLength={120} onChange={(e) => setValues({ ...values, workshop: e.target.value })} />
          </Field>
          <Field id={ids.instruments} label="Instruments you measure with" error={errors.instruments}>
            <Textarea {...controlA11y(ids.instruments, { error: errors.instruments })} value={values.instruments} maxLength={1000} onChange={(e) => setValues({ ...values, instruments: e.target.value })} />
          </Field>
          <Field id={ids.link} label="A link to your work" hint="Your site or a public page about your tests (https://…)." error={errors.link}>
            <Input {...controlA11y(ids.link, { hint: true, error: errors.link })} value={values.link} type="url" maxLength={300} onChange={(e) => setValues({ ...values, link: e.target.value })} />
          </Field>
          {apply.isError ? (
            <p role="alert" className="text-danger">
              {describeError(apply.error)}
            </p>
          ) : null}
          <div>
            <Button type="submit" busy={apply.isPending}>
              Send the application
            </Button>
          </div>
        </form>
      ) : null}
    </section>
  );
}
