/**
 * A publisher's script against API v1, typed by a client generated from the API's own
 * description: it reads every approved result of one steel, page by page, following each answer's
 * `Link: <…>; rel="next"` (RFC 8288) until there is none, and prints what it read as JSON.
 *
 * Generate the types first (any running Edgeledger server):
 *   npx openapi-typescript http://localhost:3000/api/v1/openapi.json -o examples/publisher-client/api-types.d.ts
 * then run it:
 *   EDGELEDGER_URL=http://localhost:3000 EDGELEDGER_TOKEN=… npx tsx examples/publisher-client/page-results.ts aisi-d2
 *
 * tests/api/openapi-client.test.ts generates the types, compiles this file with tsc and runs it
 * against the app.
 */
import type { paths } from './api-types';

type ResultPage = paths['/results']['get']['responses'][200]['content']['application/json'];
type ResultQuery = NonNullable<paths['/results']['get']['parameters']['query']>;
type Refusal = paths['/results']['get']['responses'][400]['content']['application/json'];

/** The target of `rel` in an RFC 8288 Link header, or null when the header names none. */
export function linkTarget(header: string | null, rel: string): string | null {
  for (const part of (header ?? '').split(',')) {
    const match = /^\s*<([^>]*)>\s*;(.*)$/.exec(part);
    if (match && match[2].split(';').some((param) => param.trim().replace(/"/g, '') === `rel=${rel}`)) return match[1];
  }
  return null;
}

async function main() {
  const base = process.env.EDGELEDGER_URL ?? 'http://localhost:3000';
  const token = process.env.EDGELEDGER_TOKEN;
  const query: ResultQuery = { steel: process.argv[2] ?? 'aisi-d2', status: 'approved' };
  let next: string | null = `/api/v1/results?${new URLSearchParams(Object.entries(query).map(([k, v]) => [k, String(v)]))}`;
  const read: { id: number; steel: string; abrasiveName: string; sharpnessMedianG: number }[] = [];
  let pages = 0;
  let total = 0;
  while (next) {
    const res = await fetch(new URL(next, base), { headers: token ? { Authorization: `Bearer ${token}` } : {} });
    if (!res.ok) {
      const refusal = (await res.json()) as Refusal;
      throw new Error(`${res.status} ${refusal.error} ${(refusal.issues ?? []).map((i) => `${i.path}: ${i.message}`).join('; ')}`);
    }
    const page = (await res.json()) as ResultPage;
    pages += 1;
    total = page.total;
    for (const result of page.items) read.push({ id: result.id, steel: result.steel, abrasiveName: result.abrasiveName, sharpnessMedianG: result.derived.sharpnessMedianG });
    next = linkTarget(res.headers.get('link'), 'next');
  }
  process.stdout.write(JSON.stringify({ pages, total, results: read }));
}

main().catch((err: unknown) => {
  process.stderr.write(`${err instanceof Error ? err.message : String(err)}\n`);
  process.exitCode = 1;
});
