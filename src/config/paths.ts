/**
 * Every URL the client links to, built in one place so no page types a path by hand.
 * `path` is the router pattern; `getHref` builds a concrete link.
 */

function withQuery(base: string, params: Record<string, string | number | undefined | null>): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value !== undefined && value !== null && value !== '') search.set(key, String(value));
  }
  const qs = search.toString();
  return qs ? `${base}?${qs}` : base;
}

/** Filters of the comparison page, as they appear in its URL. */
export interface CompareFilters {
  method?: string;
  /** One slug, or several joined by commas. */
  steel?: string;
  material?: string;
  hrcMin?: string;
  hrcMax?: string;
  /** The rest of the comparison's URL (shared/schemas/compare.ts names them all). */
  [key: string]: string | undefined;
}

/** Filters of the results list, as they appear in its URL. */
export interface ResultFilters {
  steel?: string;
  abrasive?: string;
  method?: string;
  page?: number;
}

export const paths = {
  home: { path: '/', getHref: () => '/' },
  search: { path: '/search', getHref: (q?: string) => withQuery('/search', { q }) },
  results: {
    path: '/results',
    getHref: (filters: ResultFilters = {}) => withQuery('/results', { ...filters }),
  },
  newResult: { path: '/results/new', getHref: () => '/results/new' },
  result: { path: '/results/:id', getHref: (id: number | string) => `/results/${encodeURIComponent(String(id))}` },
  editResult: { path: '/results/:id/edit', getHref: (id: number | string) => `/results/${encodeURIComponent(String(id))}/edit` },
  myResults: { path: '/me', getHref: () => '/me' },
  workshop: { path: '/workshop', getHref: () => '/workshop' },
  reviewDesk: {
    path: '/review',
    getHref: (open?: number) => withQuery('/review', { open }),
  },
  compare: { path: '/compare', getHref: (filters: CompareFilters = {}) => withQuery('/compare', { ...filters }) },
  steels: { path: '/steels', getHref: () => '/steels' },
  steel: { path: '/steels/:slug', getHref: (slug: string) => `/steels/${encodeURIComponent(slug)}` },
  /** A steel's decision view: its options side by side and the difference between two. */
  decide: {
    path: '/steels/:slug/decide',
    getHref: (slug: string, params: Record<string, string | undefined> = {}) => withQuery(`/steels/${encodeURIComponent(slug)}/decide`, params),
  },
  abrasives: { path: '/abrasives', getHref: () => '/abrasives' },
  abrasive: { path: '/abrasives/:slug', getHref: (slug: string) => `/abrasives/${encodeURIComponent(slug)}` },
  methods: { path: '/methods', getHref: () => '/methods' },
  method: { path: '/methods/:slug', getHref: (slug: string) => `/methods/${encodeURIComponent(slug)}` },
  tools: {
    index: { path: '/tools', getHref: () => '/tools' },
    grit: { path: '/tools/grit', getHref: () => '/tools/grit' },
    angle: { path: '/tools/angle', getHref: () => '/tools/angle' },
    sideAngle: { path: '/tools/side-angle', getHref: () => '/tools/side-angle' },
    hardness: { path: '/tools/hardness', getHref: () => '/tools/hardness' },
    wheelLog: { path: '/tools/wheel-log', getHref: () => '/tools/wheel-log' },
  },
  signIn: { path: '/sign-in', getHref: (returnTo?: string) => withQuery('/sign-in', { returnTo }) },
  /** The wiki on a steel, abrasive or method page; `section` is "steels", "abrasives" or "methods". */
  wiki: {
    /** A new page of the section (moderators, admins): one route per section, so "/steels/new" outranks "/steels/:slug". */
    create: { paths: ['/steels/new', '/abrasives/new', '/methods/new'], getHref: (section: string) => `/${section}/new` },
    edit: { path: '/:section/:slug/edit', getHref: (section: string, slug: string) => `/${section}/${encodeURIComponent(slug)}/edit` },
    history: { path: '/:section/:slug/history', getHref: (section: string, slug: string) => `/${section}/${encodeURIComponent(slug)}/history` },
    compare: {
      path: '/:section/:slug/history/compare',
      getHref: (section: string, slug: string, from: number, to: number) => withQuery(`/${section}/${encodeURIComponent(slug)}/history/compare`, { from, to }),
    },
    revision: { path: '/:section/:slug/revisions/:id', getHref: (section: string, slug: string, id: number) => `/${section}/${encodeURIComponent(slug)}/revisions/${id}` },
    page: (section: string, slug: string) => `/${section}/${encodeURIComponent(slug)}`,
  },
  /** Publishing and curation: import, profiles, unsubscribe, the audit log, publisher applications, mail catcher. */
  importResults: { path: '/import', getHref: () => '/import' },
  profile: { path: '/members/:handle', getHref: (handle: string) => `/members/${encodeURIComponent(handle)}` },
  unsubscribe: { path: '/unsubscribe', getHref: () => '/unsubscribe' },
  audit: { path: '/audit', getHref: () => '/audit' },
  publisherApplications: { path: '/admin/publishers', getHref: () => '/admin/publishers' },
  adminUsers: { path: '/admin/members', getHref: (q?: string) => withQuery('/admin/members', { q }) },
  devMail: { path: '/dev/mail', getHref: () => '/dev/mail' },
  /** Server routes: reached by a full-page navigation, never by the client router. */
  auth: {
    signIn: (returnTo: string, as?: string) => withQuery('/auth/signin', { as, returnTo }),
    signOut: '/auth/signout',
    demoAccounts: '/auth/demo-accounts',
  },
} as const;

/**
 * A returnTo value is only honoured when it is a path on this site, so a crafted link cannot
 * send someone elsewhere after signing in.
 */
export function safeReturnTo(value: string | null | undefined): string {
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return '/';
  return value;
}
