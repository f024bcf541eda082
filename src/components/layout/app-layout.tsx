import { Suspense, type ReactNode } from 'react';
import { Outlet, useNavigation } from 'react-router-dom';
import { Loading } from '@/components/ui/states';
import { Header } from './header';
import { Footer } from './footer';

function Frame({ children, loading }: { children: ReactNode; loading: boolean }) {
  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-10 focus:rounded focus:bg-panel focus:px-3 focus:py-2"
      >
        Skip to content
      </a>
      <Header />
      {loading ? (
        <div role="progressbar" aria-label="Opening page" className="h-0.5 w-full animate-pulse bg-accent" />
      ) : (
        <div aria-hidden="true" className="h-0.5" />
      )}
      <main id="main" tabIndex={-1} className="mx-auto w-full max-w-6xl flex-1 px-4 py-8 focus:outline-none">
        {children}
      </main>
      <Footer />
    </div>
  );
}

/** Frame of every page: skip link, header, the page itself, footer, and a bar while a page loads. */
export function AppLayout() {
  const navigation = useNavigation();
  return (
    <Frame loading={navigation.state === 'loading'}>
      <Suspense fallback={<Loading />}>
        <Outlet />
      </Suspense>
    </Frame>
  );
}

/** What shows while the first page's own code is still on its way: the same frame, a loading note. */
export function AppLayoutFallback() {
  return (
    <Frame loading>
      <Loading />
    </Frame>
  );
}
