import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';

/** The site footer: what the data is, and where the test methods are written down. */
export function Footer() {
  return (
    <footer className="mt-16 border-t border-rule bg-panel">
      <div className="mx-auto flex max-w-6xl flex-col gap-2 px-4 py-6 text-sm text-muted md:flex-row md:justify-between">
        <p>
          Edgeledger shows measurements with their method, sample size and spread. The demo data is invented.
        </p>
        <p>
          <Link to={paths.methods.getHref()}>How results are measured</Link>
        </p>
      </div>
    </footer>
  );
}
