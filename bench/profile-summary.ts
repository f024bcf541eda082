/**
 * `npx tsx bench/profile-summary.ts <file.cpuprofile> [top] [lastSeconds]`: the functions that took the most
 * CPU time in a V8 CPU profile (node --cpu-prof, or the load bench's BENCH_PROFILE), by self
 * time and by total time (self plus callees, each function counted once per stack), with their
 * file and line. Idle and garbage collection are listed as V8 names them. With lastSeconds, only
 * the samples of the profile's last that many seconds (the bench's last phase, without the boot).
 */
import fs from 'node:fs';

interface Node {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
  children?: number[];
}
interface Profile {
  nodes: Node[];
  samples: number[];
  timeDeltas: number[];
}

const [file, topArg, lastArg] = process.argv.slice(2);
if (!file) {
  console.error('usage: tsx bench/profile-summary.ts <file.cpuprofile> [top]');
  process.exit(2);
}
const top = Number(topArg ?? 25);
const profile = JSON.parse(fs.readFileSync(file, 'utf8')) as Profile;
const byId = new Map(profile.nodes.map((n) => [n.id, n]));
const parent = new Map<number, number>();
for (const n of profile.nodes) for (const c of n.children ?? []) parent.set(c, n.id);

const label = (n: Node) => {
  const url = n.callFrame.url.replace(/^file:\/\//, '').replace(process.cwd() + '/', '');
  return `${n.callFrame.functionName || '(anonymous)'} ${url ? `${url}:${n.callFrame.lineNumber + 1}` : ''}`.trim();
};

const self = new Map<string, number>();
const total = new Map<string, number>();
let all = 0;
const at: number[] = [];
profile.timeDeltas.reduce((t, d, i) => (at[i] = t + d), 0);
const since = lastArg ? at[at.length - 1] - Number(lastArg) * 1e6 : -Infinity;
profile.samples.forEach((id, i) => {
  if (at[i] < since) return;
  const ms = (profile.timeDeltas[i] ?? 0) / 1000;
  all += ms;
  const leaf = byId.get(id)!;
  self.set(label(leaf), (self.get(label(leaf)) ?? 0) + ms);
  const seen = new Set<string>();
  for (let at: number | undefined = id; at !== undefined; at = parent.get(at)) {
    const l = label(byId.get(at)!);
    if (seen.has(l)) continue;
    seen.add(l);
    total.set(l, (total.get(l) ?? 0) + ms);
  }
});

const print = (title: string, m: Map<string, number>) => {
  console.log(`\n${title} (of ${Math.round(all)} ms sampled)`);
  for (const [l, ms] of [...m].sort((a, b) => b[1] - a[1]).slice(0, top)) console.log(`${String(Math.round(ms)).padStart(8)} ms ${((ms / all) * 100).toFixed(1).padStart(5)} %  ${l}`);
};
print('Self time', self);
print('Total time', total);
