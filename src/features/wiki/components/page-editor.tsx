import { lazy, Suspense, useId, useMemo, useState } from 'react';
import { Controller, FormProvider, useForm, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { mergeEdits } from '@shared/page-diff';
import { normalizeFields, pageCreateSchemas, pageEditSchemas, type PageContent, type PageCreate, type PageEdit, type PageType } from '@shared/schemas/pages';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { friendlyZodMessages } from '@/lib/zod-messages';
import { Button } from '@/components/ui/button';
import { controlA11y, Field, Input } from '@/components/ui/field';
import { describeError, Loading } from '@/components/ui/states';
import { useSavePage } from '../api/save-page';
import { useCreatePage } from '../api/create-page';
import { wikiPageQueryOptions } from '../api/get-wiki-page';
import { revisionQueryOptions } from '../api/get-revision';
import { SECTION_LABELS, SECTION_TYPES, type Revision, type WikiPage, type WikiSection } from '../types';
import { contentOfEdit, emptyFormValues, toFormValues, toPageCreate, toPageEdit, type PageFormValues } from './page-form-values';
import { CitationsFields, TypeFields } from './page-fields';
import { RevisionDiff } from './revision-diff';

// The editor is about as large as the rest of the app together: it loads only with this form.
const NotesEditor = lazy(() => import('@/features/results/components/notes-editor'));

/** A revision's content, its fields reduced to the editable ones. */
export const contentOfRevision = (type: PageType, r: Pick<Revision, 'fields' | 'body'>): PageContent => ({ fields: normalizeFields(type, r.fields), body: r.body });

/** The page as GET gives it, as content (its fields have the same names as a revision's). */
const contentOfPage = (type: PageType, page: WikiPage): PageContent => ({ fields: normalizeFields(type, page), body: page.body });

/** Someone saved first: their revision, the one this edit began from, and the merge offered. */
interface Stale {
  mine: PageContent;
  base: Revision;
  current: Revision;
  conflicts: string[];
  merged: PageContent;
}

/** The form checked with the server's schema: an edit's, or a new page's (no base revision). */
function resolverFor(type: PageType, isNew: boolean): Resolver<PageFormValues, unknown, PageEdit> {
  const zod = zodResolver((isNew ? pageCreateSchemas : pageEditSchemas)[type] as never, { error: friendlyZodMessages });
  return async (values, context, options) => {
    const out = await zod((isNew ? toPageCreate(type, values) : toPageEdit(type, values)) as never, context, options as never);
    if (Object.keys(out.errors).length === 0) return { values: out.values as unknown as PageEdit, errors: {} };
    return { values: {}, errors: out.errors as never };
  };
}

/**
 * The wiki's edit form for a steel, abrasive or method page: the type's fields (zod-checked as
 * one types, with the same schema the server uses), references and their use in the infobox,
 * the body in TipTap, and a summary. A member's save becomes a proposal for the review desk; a
 * publisher's or moderator's goes live. When someone saved first, nothing is lost: the form
 * shows what they changed, which fields both changed, and offers to carry on from their
 * revision with this edit's other changes merged in. Without a page it starts a new one
 * (moderators and admins): the same form, empty, saved through POST /api/{section}.
 */
export function PageEditor({ section, page }: { section: WikiSection; page: WikiPage | null }) {
  const type = SECTION_TYPES[section];
  const summaryId = useId();
  const bodyId = useId();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const resolver = useMemo(() => resolverFor(type, !page), [type, page]);
  const form = useForm<PageFormValues, unknown, PageEdit>({
    resolver,
    mode: 'onTouched',
    defaultValues: page ? toFormValues(type, contentOfPage(type, page), page.revision) : emptyFormValues(type),
  });
  const saveEdit = useSavePage(section, page?.slug ?? '');
  const create = useCreatePage(section);
  const save = page ? saveEdit : create;
  const [stale, setStale] = useState<Stale | null>(null);
  const [proposed, setProposed] = useState<Revision | null>(null);
  const [loadingStale, setLoadingStale] = useState(false);

  const onStale = async (edit: PageEdit) => {
    if (!page) return;
    setLoadingStale(true);
    try {
      const fresh = await queryClient.fetchQuery({ ...wikiPageQueryOptions(section, page.slug), staleTime: 0 });
      const [base, current] = await Promise.all([
        queryClient.fetchQuery(revisionQueryOptions(section, page.slug, edit.baseRevision)),
        queryClient.fetchQuery(revisionQueryOptions(section, page.slug, fresh.revision)),
      ]);
      const mine = contentOfEdit(type, edit);
      const merge = mergeEdits(type, contentOfRevision(type, base), mine, contentOfRevision(type, current));
      setStale({ mine, base, current, conflicts: merge.conflicts, merged: merge.content });
    } finally {
      setLoadingStale(false);
    }
  };

  const submit = form.handleSubmit((edit) => {
    setStale(null);
    if (!page) {
      create.mutate(edit as unknown as PageCreate, { onSuccess: (outcome) => navigate(paths.wiki.page(section, outcome.page.slug), { state: { saved: outcome.revision.id } }) });
      return;
    }
    saveEdit.mutate(edit, {
      onSuccess: (outcome) => {
        if (outcome.status === 'live') navigate(paths.wiki.page(section, page.slug), { state: { saved: outcome.revision.id } });
        else setProposed(outcome.revision);
      },
      onError: (error) => {
        if (error instanceof ApiError && error.status === 409) void onStale(edit);
      },
    });
  });

  /** Carries on from the current revision: their changes kept, this edit's re-applied; on a conflict this edit's value stays, to be reviewed. */
  const continueFromCurrent = () => {
    if (!stale) return;
    const fields = { ...stale.merged.fields };
    for (const c of stale.conflicts) if (c !== 'body') fields[c] = stale.mine.fields[c];
    if (stale.conflicts.includes('citations')) fields.sources = stale.mine.fields.sources;
    const body = stale.conflicts.includes('body') ? stale.mine.body : stale.merged.body;
    form.reset(toFormValues(type, { fields, body }, stale.current.id, form.getValues('summary')));
    setStale(null);
    save.reset();
  };

  if (proposed && page) {
    return (
      <div role="status" className="flex flex-col gap-3 rounded-md border border-accent/40 bg-accent-soft px-5 py-4">
        <p className="font-serif text-lg">Thank you: your edit is waiting for review.</p>
        <p>
          A moderator will look at revision {proposed.number} of this page on the review desk. Until then the page shows the last approved version; you can follow the edit in the
          page’s history.
        </p>
        <div className="flex flex-wrap gap-4">
          <Link to={paths.wiki.revision.getHref(section, page.slug, proposed.id)}>Your proposed revision</Link>
          <Link to={paths.wiki.history.getHref(section, page.slug)}>History</Link>
          <Link to={paths.wiki.page(section, page.slug)}>Back to the page</Link>
        </div>
      </div>
    );
  }

  const summaryError = form.formState.errors.summary?.message;
  const bodyError = (form.formState.errors.body as { message?: string } | undefined)?.message;
  // A 409 on an edit is someone saving first (the panel below); on a new page, a slug taken.
  const serverError = save.error && !(page && save.error instanceof ApiError && save.error.status === 409) ? save.error : null;
  const issues = serverError instanceof ApiError ? serverError.issues : [];

  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={submit} aria-label={page ? `Edit ${page.name}` : `New ${SECTION_LABELS[section].one} page`} className="flex flex-col gap-8">
        {page?.isProtected ? (
          <p className="rounded-md border border-caution/40 bg-caution-soft px-4 py-2 text-caution">This page is protected: only moderators edit it.</p>
        ) : null}

        <section aria-labelledby="edit-facts" className="flex flex-col gap-4">
          <h2 id="edit-facts" className="text-xl font-semibold">
            Facts
          </h2>
          <TypeFields type={type} />
        </section>

        <section aria-labelledby="edit-body" className="flex flex-col gap-2">
          <h2 id="edit-body" className="text-xl font-semibold">
            Text
          </h2>
          <p id={`${bodyId}-hint`} className="text-sm text-muted">
            Link another page with its address, e.g. /steels/aisi-d2 or /abrasives/&lt;name&gt;; a link to a page that does not exist shows as missing.
          </p>
          <Controller
            control={form.control}
            name="body"
            render={({ field }) => (
              <Suspense fallback={<Loading label="Loading the editor…" />}>
                <NotesEditor id={bodyId} value={field.value} onChange={field.onChange} onBlur={field.onBlur} describedBy={`${bodyId}-hint`} invalid={!!bodyError} />
              </Suspense>
            )}
          />
          {bodyError ? <p className="text-sm font-medium text-danger">{bodyError}</p> : null}
        </section>

        <section aria-labelledby="edit-refs" className="flex flex-col gap-3">
          <h2 id="edit-refs" className="text-xl font-semibold">
            References
          </h2>
          <CitationsFields type={type} />
        </section>

        <section aria-labelledby="edit-save" className="flex flex-col gap-3 rounded-md border border-rule bg-panel p-4">
          <h2 id="edit-save" className="text-xl font-semibold">
            Save
          </h2>
          <Field
            id={summaryId}
            label={page ? 'Summary of your changes' : 'Summary (optional)'}
            hint={page ? 'Shown in the page’s history, e.g. “Composition from ASTM A681”.' : 'Shown in the page’s history; left blank, it reads “First version.”'}
            error={summaryError}
          >
            <Input {...controlA11y(summaryId, { hint: true, error: summaryError })} {...form.register('summary')} maxLength={300} />
          </Field>
          {serverError ? (
            <div role="alert" className="text-danger">
              <p>{describeError(serverError)}</p>
              {issues.length ? (
                <ul className="list-disc pl-5 text-sm">
                  {issues.map((i) => (
                    <li key={`${i.path}-${i.message}`}>
                      {i.path}: {i.message}
                    </li>
                  ))}
                </ul>
              ) : null}
            </div>
          ) : null}
          {Object.keys(form.formState.errors).length && form.formState.isSubmitted ? (
            <p role="alert" className="text-danger">
              Some entries need a look; they are marked above.
            </p>
          ) : null}
          <div className="flex flex-wrap items-center gap-3">
            <Button type="submit" busy={save.isPending}>
              {!page ? 'Create the page' : page.can.publish ? 'Save and publish' : 'Propose this edit'}
            </Button>
            <Link to={page ? paths.wiki.page(section, page.slug) : `/${section}`}>Cancel</Link>
            {page && !page.can.publish ? <span className="text-sm text-muted">A moderator reviews it before it shows on the page.</span> : null}
          </div>
        </section>

        {loadingStale ? <Loading label="Someone saved this page meanwhile; loading their changes…" /> : null}
        {stale ? <StalePanel type={type} stale={stale} onContinue={continueFromCurrent} /> : null}
      </form>
    </FormProvider>
  );
}

function StalePanel({ type, stale, onContinue }: { type: PageType; stale: Stale; onContinue: () => void }) {
  const who = stale.current.author?.handle ?? 'someone';
  return (
    <section role="alert" aria-labelledby="stale-title" className="flex flex-col gap-4 rounded-md border border-caution/50 bg-caution-soft/60 p-4">
      <h2 id="stale-title" className="text-xl font-semibold">
        {who} saved this page while you were editing
      </h2>
      <p>
        Nothing of yours was saved and nothing of theirs was overwritten. Revision {stale.current.number} (“{stale.current.summary}”) is now current.
        {stale.conflicts.length ? (
          <>
            {' '}
            You both changed: <strong>{stale.conflicts.join(', ')}</strong>. If you carry on, your version of those stays in the form: check it against theirs below
            before saving.
          </>
        ) : (
          ' Your changes and theirs touch different parts, so they merge cleanly.'
        )}
      </p>
      <div>
        <Button onClick={onContinue}>Carry on from revision {stale.current.number} with my changes</Button>
      </div>
      <h3 className="text-lg font-semibold">What they changed</h3>
      <RevisionDiff type={type} before={contentOfRevision(type, stale.base)} after={contentOfRevision(type, stale.current)} beforeLabel={`Revision ${stale.base.number} (where you started)`} afterLabel={`Revision ${stale.current.number} (theirs)`} />
      <h3 className="text-lg font-semibold">Yours against the current page</h3>
      <RevisionDiff type={type} before={contentOfRevision(type, stale.current)} after={stale.mine} beforeLabel={`Revision ${stale.current.number}`} afterLabel="Your edit" />
    </section>
  );
}
