import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { SignInRequired } from '@/lib/authorization';
import { PageTitle } from '@/components/ui/page-title';
import { ErrorState, Loading } from '@/components/ui/states';
import { useWikiPage } from '../api/get-wiki-page';
import type { WikiSection } from '../types';
import { PageEditor } from './page-editor';
import { NotAWikiPage, useWikiParams, WikiCrumbs } from './wiki-route-frame';

function EditLoaded({ section, slug }: { section: WikiSection; slug: string }) {
  const page = useWikiPage(section, slug);
  if (page.isPending) return <Loading />;
  if (page.isError) return <ErrorState error={page.error} onRetry={() => page.refetch()} />;
  if (!page.data.can.edit) {
    return (
      <div role="alert" className="rounded-md border border-rule bg-panel px-5 py-6">
        <p className="font-serif text-lg">{page.data.isProtected ? 'This page is protected: only moderators edit it.' : 'You cannot edit this page.'}</p>
        <p className="mt-2">
          <Link to={paths.wiki.history.getHref(section, slug)}>See its history</Link>
        </p>
      </div>
    );
  }
  return (
    <>
      <WikiCrumbs section={section} slug={slug} name={page.data.name} here="Edit" />
      <PageTitle title={`Edit ${page.data.name}`} lead={`Editing from revision ${page.data.revisionNumber} of this page.`}>
        Edit {page.data.name}
      </PageTitle>
      <PageEditor key={page.data.slug} section={section} page={page.data} />
    </>
  );
}

/** /:section/:slug/edit: the edit form of a steel, abrasive or method page (signed-in people). */
export default function EditPageRoute() {
  const params = useWikiParams();
  if (!params) return <NotAWikiPage />;
  return (
    <div className="flex flex-col gap-6">
      <SignInRequired what="edit this page">
        <EditLoaded {...params} />
      </SignInRequired>
    </div>
  );
}
