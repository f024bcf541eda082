import type { ReactNode } from 'react';
import { Link, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { isWikiSection, SECTION_LABELS, type WikiSection } from '../types';

/** The section and slug of a wiki route, or null when the section is not one of the wiki's. */
export function useWikiParams(): { section: WikiSection; slug: string } | null {
  const { section, slug = '' } = useParams();
  return isWikiSection(section) ? { section, slug } : null;
}

/** Breadcrumbs above a wiki page: section list › page › what this view is. */
export function WikiCrumbs({ section, slug, name, here }: { section: WikiSection; slug: string; name?: string; here?: string }) {
  const listHref = section === 'steels' ? paths.steels.getHref() : section === 'abrasives' ? paths.abrasives.getHref() : paths.methods.getHref();
  return (
    <nav aria-label="Breadcrumb" className="-mb-4 text-sm">
      <Link to={listHref}>{SECTION_LABELS[section].many}</Link>
      <span aria-hidden="true"> › </span>
      <Link to={paths.wiki.page(section, slug)}>{name ?? slug}</Link>
      {here ? (
        <>
          <span aria-hidden="true"> › </span>
          <span>{here}</span>
        </>
      ) : null}
    </nav>
  );
}

/** Shown when a wiki route's section is unknown. */
export function NotAWikiPage(): ReactNode {
  return <p className="text-muted">There is no such page here.</p>;
}
