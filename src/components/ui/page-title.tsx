import { useEffect, type ReactNode } from 'react';

/** A page's main heading; also sets the browser tab's title. */
export function PageTitle({ children, title, lead }: { children: ReactNode; title: string; lead?: ReactNode }) {
  useEffect(() => {
    document.title = `${title} · Edgeledger`;
  }, [title]);
  return (
    <header>
      <h1 className="font-serif text-3xl font-semibold leading-tight">{children}</h1>
      {lead ? <p className="mt-2 max-w-3xl text-muted">{lead}</p> : null}
    </header>
  );
}
