import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { buttonClasses } from '@/components/ui/button';
import { useCan } from '@/lib/auth';
import { SECTION_LABELS, type WikiSection } from '../types';

/** "New steel page" (etc.) above a section's list, for moderators and admins only. */
export function NewPageLink({ section }: { section: WikiSection }) {
  if (!useCan('create:page')) return null;
  return (
    <div>
      <Link to={paths.wiki.create.getHref(section)} className={buttonClasses('primary')}>
        New {SECTION_LABELS[section].one} page
      </Link>
    </div>
  );
}
