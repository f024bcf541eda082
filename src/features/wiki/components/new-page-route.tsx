import { Link, useLocation } from 'react-router-dom';
import { SignInRequired } from '@/lib/authorization';
import { PageTitle } from '@/components/ui/page-title';
import { isWikiSection, SECTION_LABELS } from '../types';
import { PageEditor } from './page-editor';
import { NotAWikiPage } from './wiki-route-frame';

/** /steels/new, /abrasives/new, /methods/new: the edit form, empty, for a new page (moderators and admins). */
export default function NewPageRoute() {
  const section = useLocation().pathname.split('/')[1];
  if (!isWikiSection(section)) return <NotAWikiPage />;
  const { one, many } = SECTION_LABELS[section];
  return (
    <div className="flex flex-col gap-6">
      <nav aria-label="Breadcrumb" className="-mb-4 text-sm">
        <Link to={`/${section}`}>{many}</Link>
        <span aria-hidden="true"> › </span>
        <span>New page</span>
      </nav>
      <PageTitle title={`New ${one} page`} lead="The page goes live as its revision 1; its address is made from the name.">
        New {one} page
      </PageTitle>
      <SignInRequired action="create:page" what={`start a ${one} page`} who="moderators and admins">
        <PageEditor section={section} page={null} />
      </SignInRequired>
    </div>
  );
}
