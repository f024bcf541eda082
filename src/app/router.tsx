import type { ComponentType } from 'react';
import { createBrowserRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { paths } from '@/config/paths';
import { AppLayout, AppLayoutFallback } from '@/components/layout/app-layout';
import { RouteError } from '@/components/errors/route-error';

/**
 * Turns a module with a default-exported page into a lazy route, so each page is its own
 * chunk and the first page's JavaScript stays small.
 */
function page(load: () => Promise<{ default: ComponentType }>): Pick<RouteObject, 'lazy' | 'ErrorBoundary'> {
  return {
    lazy: async () => ({ Component: (await load()).default }),
    ErrorBoundary: RouteError,
  };
}

const routes: RouteObject[] = [
  {
    path: '/',
    Component: AppLayout,
    HydrateFallback: AppLayoutFallback,
    ErrorBoundary: RouteError,
    children: [
      { index: true, ...page(() => import('./routes/home')) },
      { path: paths.search.path, ...page(() => import('./routes/search')) },
      { path: paths.results.path, ...page(() => import('./routes/results')) },
      { path: paths.newResult.path, ...page(() => import('./routes/new-result')) },
      { path: paths.result.path, ...page(() => import('./routes/result')) },
      { path: paths.editResult.path, ...page(() => import('./routes/edit-result')) },
      { path: paths.myResults.path, ...page(() => import('./routes/my-results')) },
      { path: paths.reviewDesk.path, ...page(() => import('./routes/review-desk')) },
      { path: paths.compare.path, ...page(() => import('./routes/compare')) },
      { path: paths.steels.path, ...page(() => import('./routes/steels')) },
      { path: paths.steel.path, ...page(() => import('./routes/steel')) },
      { path: paths.decide.path, ...page(() => import('./routes/decide')) },
      { path: paths.abrasives.path, ...page(() => import('./routes/abrasives')) },
      { path: paths.abrasive.path, ...page(() => import('./routes/abrasive')) },
      { path: paths.methods.path, ...page(() => import('./routes/methods')) },
      { path: paths.method.path, ...page(() => import('./routes/method')) },
      ...paths.wiki.create.paths.map((path) => ({ path, ...page(() => import('@/features/wiki/components/new-page-route')) })),
      { path: paths.wiki.edit.path, ...page(() => import('@/features/wiki/components/edit-page-route')) },
      { path: paths.wiki.history.path, ...page(() => import('@/features/wiki/components/history-route')) },
      { path: paths.wiki.compare.path, ...page(() => import('@/features/wiki/components/compare-route')) },
      { path: paths.wiki.revision.path, ...page(() => import('@/features/wiki/components/revision-route')) },
      { path: paths.signIn.path, ...page(() => import('./routes/sign-in')) },
      { path: paths.tools.index.path, ...page(() => import('@/features/tools/components/tools-index')) },
      { path: paths.tools.grit.path, ...page(() => import('@/features/tools/components/grit-translator')) },
      { path: paths.tools.angle.path, ...page(() => import('@/features/tools/components/angle-geometry')) },
      { path: paths.workshop.path, ...page(() => import('@/features/workshop/components/workshop-page')) },
      { path: paths.tools.sideAngle.path, ...page(() => import('@/features/tools/components/side-angle')) },
      { path: paths.tools.hardness.path, ...page(() => import('@/features/tools/components/hardness-converter')) },
      { path: paths.tools.wheelLog.path, ...page(() => import('@/features/wheel-log/components/wheel-log-page')) },
      { path: paths.importResults.path, ...page(() => import('@/features/import/components/import-page')) },
      { path: paths.profile.path, ...page(() => import('@/features/profiles/components/profile-page')) },
      { path: paths.unsubscribe.path, ...page(() => import('@/features/me/components/unsubscribe-page')) },
      { path: paths.audit.path, ...page(() => import('@/features/curation/components/audit-log-page')) },
      { path: paths.adminUsers.path, ...page(() => import('@/features/admin/components/admin-users-page')) },
      { path: paths.publisherApplications.path, ...page(() => import('@/features/publishers/components/applications-page')) },
      { path: paths.devMail.path, ...page(() => import('@/features/dev-mail/components/dev-mail-page')) },
      { path: '*', ...page(() => import('./routes/not-found')) },
    ],
  },
];

const router = createBrowserRouter(routes);

/** The app's pages, wired to the browser's address bar. */
export function AppRouter() {
  return <RouterProvider router={router} />;
}
