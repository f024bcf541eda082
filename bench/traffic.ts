/**
 * The benches' traffic: requests built afresh from the data's own vocabulary (steel, abrasive
 * and method names, designations, materials, grits), so that no two are alike unless real
 * visitors would ask the same (a steel's page). Used by bench/load.ts and bench/compare.ts.
 */
import { mulberry32 } from '../seed/data/results';

/** The same traffic on every run. */
export const rand = mulberry32(0x10ad);
const pick = <T>(list: readonly T[]) => list[Math.floor(rand() * list.length)];
const some = <T>(list: readonly T[], most: number) => [...new Set(Array.from({ length: 1 + Math.floor(rand() * most) }, () => pick(list)))];
const between = (lo: number, hi: number, step: number) => Math.round((lo + rand() * (hi - lo)) / step) * step;

export interface Vocabulary {
  steels: { slug: string; name: string; designations: { code: string }[]; category: string }[];
  abrasives: { slug: string; name: string; material: string; bond: string; grit: { grade: string } }[];
  methods: { slug: string; name: string; readingsPerEdge: number; retentionMedium: string | null }[];
  listPages: number;
  words: string[];
}

export async function vocabulary(base: string): Promise<Vocabulary> {
  const json = async <T>(p: string) => {
    const res = await fetch(`${base}${p}`);
    if (!res.ok) throw new Error(`the bench's vocabulary: GET ${p} answered ${res.status} ${(await res.text()).slice(0, 300)}`);
    return (await res.json()) as T;
  };
  const steels = (await json<{ items: Vocabulary['steels'] }>('/api/steels')).items;
  const abrasives = (await json<{ items: Vocabulary['abrasives'] }>('/api/abrasives')).items;
  const methods = (await json<{ items: Vocabulary['methods'] }>('/api/methods')).items;
  const total = (await json<{ total: number }>('/api/results?status=approved')).total;
  if (!Number.isInteger(total)) throw new Error(`the bench's vocabulary: GET /api/results?status=approved gave no total (${total})`);
  const words = new Set<string>();
  const add = (text: string) => {
    for (const w of text.toLowerCase().split(/[^a-z0-9µ.]+/)) if (w.length >= 2 && !['invented', 'bench'].includes(w)) words.add(w);
  };
  for (const s of steels) {
    add(s.name);
    for (const d of s.designations) add(d.code);
  }
  for (const a of abrasives) {
    add(a.name);
    add(a.material.replace(/-/g, ' '));
    add(a.grit.grade);
  }
  for (const m of methods) add(m.name);
  return { steels, abrasives, methods, listPages: Math.max(1, Math.ceil(total / 25)), words: [...words] };
}

/** A word with one typo (a letter dropped, doubled, swapped or replaced), or cut short as someone still typing. */
export function misspell(w: string): string {
  if (w.length < 4) return w;
  const i = 1 + Math.floor(rand() * (w.length - 2));
  switch (Math.floor(rand() * 5)) {
    case 0:
      return w.slice(0, i) + w.slice(i + 1);
    case 1:
      return w.slice(0, i) + w[i] + w.slice(i);
    case 2:
      return w.slice(0, i - 1) + w[i] + w[i - 1] + w.slice(i + 1);
    case 3:
      return w.slice(0, i) + 'aeiou'[Math.floor(rand() * 5)] + w.slice(i + 1);
    default:
      return w.slice(0, Math.max(2, i));
  }
}

export type Req = { method: 'GET' | 'POST'; path: string; headers: Record<string, string>; body?: string };
export type Session = { cookie: string; csrf: string };
const TLS = { 'x-forwarded-proto': 'https' };

export function traffic(v: Vocabulary, sessions: Session[]) {
  const asked = new Set<string>();
  const get = (p: string, signedIn = false): Req => ({ method: 'GET', path: p, headers: signedIn ? { cookie: pick(sessions).cookie, ...TLS } : {} });
  const sharpness = v.methods.filter((m) => !m.retentionMedium);
  const retention = v.methods.find((m) => m.retentionMedium);
  const day = (daysAgo: number) => new Date(Date.now() - daysAgo * 86_400_000).toISOString().slice(0, 10);
  const precomputed = (): URLSearchParams => {
    const q = new URLSearchParams();
    if (rand() < 0.7) q.set('method', pick(v.methods).slug);
    if (rand() < 0.3) q.set('steel', some(v.steels, 3).map((s) => s.slug).join(','));
    if (rand() < 0.2) q.set('category', pick(v.steels).category);
    if (rand() < 0.3) q.set('material', some(v.abrasives, 2).map((a) => a.material).join(','));
    if (rand() < 0.2) q.set('umMin', String(pick([0.5, 1, 3, 10])));
    if (rand() < 0.2) q.set('umMax', String(pick([20, 40, 100, 300])));
    if (rand() < 0.3) q.set('step', '0.5');
    if (rand() < 0.5) q.set('sort', `${pick(['', '-'])}${pick(['steel', 'material', 'band', 'n', 'testers', 'median', 'mean', 'ci', 'retention', 'hrc', 'angle', 'ranked'])}`);
    q.set('page', String(1 + Math.floor(rand() * 3)));
    q.set('pageSize', String(pick([25, 50, 100])));
    return q;
  };
  const kinds = {
    compare: (signedIn = false) => get(`/api/compare?${precomputed()}`, signedIn),
    compareLive: (signedIn = false) => {
      const q = precomputed();
      const live = Math.floor(rand() * 5);
      if (live === 0 || rand() < 0.25) {
        const lo = between(54, 62, 0.5);
        q.set('hrcMin', String(lo));
        if (rand() < 0.6) q.set('hrcMax', String(lo + between(1, 6, 0.5)));
      }
      if (live === 1 || rand() < 0.25) {
        const lo = between(10, 18, 0.5);
        q.set('angleMin', String(lo));
        if (rand() < 0.6) q.set('angleMax', String(lo + between(1, 6, 0.5)));
      }
      if (live === 2 || rand() < 0.25) {
        const from = Math.floor(rand() * 900);
        q.set('postedFrom', day(from));
        if (rand() < 0.6) q.set('postedTo', day(Math.max(0, from - Math.floor(rand() * 300))));
      }
      if (live === 3 || rand() < 0.2) q.set('bond', some(v.abrasives, 2).map((a) => a.bond).join(','));
      if (live === 4 || rand() < 0.15) q.set('publisher', '1');
      return get(`/api/compare?${q}`, signedIn);
    },
    list: (signedIn = false) => get(`/api/results?status=approved&page=${1 + Math.floor(rand() * v.listPages)}`, signedIn),
    steel: (signedIn = false) => get(`/api/steels/${pick(v.steels).slug}`, signedIn),
    abrasive: (signedIn = false) => get(`/api/abrasives/${pick(v.abrasives).slug}`, signedIn),
    /** A query never asked before in this run: one to three of the data's words, some misspelt or cut short. */
    search: (): Req => {
      for (;;) {
        const words = Array.from({ length: 1 + Math.floor(rand() * 3) }, () => {
          const w = pick(v.words);
          return rand() < 0.35 ? misspell(w) : w;
        });
        const q = words.join(' ');
        if (asked.has(q)) continue;
        asked.add(q);
        return get(`/api/search?q=${encodeURIComponent(q)}`);
      }
    },
    write: (): Req => {
      const s = pick(sessions);
      const method = pick(sharpness);
      const body = {
        steel: pick(v.steels).slug,
        hardness: { value: between(56, 64, 0.5), scale: 'HRC' },
        abrasive: pick(v.abrasives).slug,
        edgeAngle: { perSideDeg: between(10, 22, 0.5) },
        sharpness: { method: method.slug, readingsG: Array.from({ length: method.readingsPerEdge }, () => between(110, 320, 1)) },
        ...(retention && rand() < 0.3 ? { retention: { method: retention.slug, cuts: between(100, 500, 1) } } : {}),
        notes: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: `Load-bench submission ${Math.floor(rand() * 1e9)} (invented)` }] }] },
      };
      return { method: 'POST', path: '/api/results', headers: { 'content-type': 'application/json', cookie: s.cookie, 'x-csrf-token': s.csrf, ...TLS }, body: JSON.stringify(body) };
    },
  };
  /** 70 % reads (30 % of readers signed in), 20 % unique searches, 10 % writes. */
  const mixed = (): Req => {
    const x = rand();
    if (x < 0.1) return kinds.write();
    if (x < 0.3) return kinds.search();
    const signedIn = rand() < 0.3;
    return pick([kinds.compare, kinds.compare, kinds.compareLive, kinds.list, kinds.steel, kinds.abrasive])(signedIn);
  };
  return { ...kinds, mixed };
}
