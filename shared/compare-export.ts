/**
 * The comparison view as CSV and JSON files: a licence header (CC BY 4.0), a citation line with
 * the date and URL of the view, and the method versions involved, then one row per cell. Text
 * that a spreadsheet would run as a formula is neutralised. Pure: the caller gives the date.
 */
import { formatBand, type CompareRow } from './compare-view';
import { neutraliseFormula, toCsv } from './csv-writer';

/** The licence every export names. */
export const EXPORT_LICENCE = { name: 'CC BY 4.0', title: 'Creative Commons Attribution 4.0 International', url: 'https://creativecommons.org/licenses/by/4.0/' } as const;

/** What an export says about where it came from. */
export interface ExportContext {
  /** The URL of the view on the site (the comparison page with its filters). */
  url: string;
  /** The day the view was taken, YYYY-MM-DD. */
  retrievedOn: string;
  /** Every method version whose results the view holds. */
  methods: { slug: string; name: string; version: number }[];
  /** The filters in words, e.g. "steel AISI D2; material CBN". */
  filters: string;
  /** Band width of the view, φ. */
  step: 1 | 0.5;
}

const oneLine = (s: string) => s.replace(/[\r\n\t]+/g, ' ').trim();

/** "Edgeledger contributors (2026). Comparison … Retrieved 2026-11-02 from <url>. Licence: CC BY 4.0." */
export function citationLine(ctx: ExportContext): string {
  const year = ctx.retrievedOn.slice(0, 4);
  const what = ctx.filters ? `Comparison of sharpening results (${oneLine(ctx.filters)})` : 'Comparison of sharpening results';
  return `Edgeledger contributors (${year}). ${what}. Edgeledger. Retrieved ${ctx.retrievedOn} from ${ctx.url}. Licence: ${EXPORT_LICENCE.name}.`;
}

const methodsLine = (ctx: ExportContext) => ctx.methods.map((m) => `${m.slug} (${oneLine(m.name)}; version ${m.version})`).join('; ');

/** The export's columns: header text and the value of each row. Grams are grams-force. */
export const EXPORT_COLUMNS: { header: string; value: (r: CompareRow) => string | number | null }[] = [
  { header: 'method', value: (r) => r.method },
  { header: 'method_version', value: (r) => r.methodVersion },
  { header: 'steel', value: (r) => r.steel },
  { header: 'steel_name', value: (r) => r.steelName },
  { header: 'abrasive_material', value: (r) => r.material },
  { header: 'grit_band', value: (r) => formatBand(r.band) },
  { header: 'band_phi_from', value: (r) => r.band.phi },
  { header: 'band_phi_to', value: (r) => r.band.phi + r.band.step },
  { header: 'band_um_low', value: (r) => round(r.band.loUm, 4) },
  { header: 'band_um_high', value: (r) => round(r.band.hiUm, 4) },
  { header: 'n', value: (r) => r.n },
  { header: 'testers', value: (r) => r.testers },
  { header: 'marks', value: (r) => marks(r) },
  { header: 'median_g', value: (r) => round(r.sharpnessG.median, 2) },
  { header: 'q1_g', value: (r) => round(r.sharpnessG.q1, 2) },
  { header: 'q3_g', value: (r) => round(r.sharpnessG.q3, 2) },
  { header: 'mean_g', value: (r) => round(r.sharpnessG.mean, 2) },
  { header: 'sd_g', value: (r) => (r.sharpnessG.sd === null ? null : round(r.sharpnessG.sd, 2)) },
  { header: 'mean_ci95_low_g', value: (r) => (r.sharpnessG.ci95 ? round(r.sharpnessG.ci95[0], 2) : null) },
  { header: 'mean_ci95_high_g', value: (r) => (r.sharpnessG.ci95 ? round(r.sharpnessG.ci95[1], 2) : null) },
  { header: 'ranked_median_g', value: (r) => round(r.rankedMedianG, 2) },
  { header: 'retention_median_cuts', value: (r) => r.retentionCuts?.median ?? null },
  { header: 'retention_n', value: (r) => r.retentionCuts?.n ?? 0 },
  { header: 'hrc_min', value: (r) => round(r.hrcRange[0], 1) },
  { header: 'hrc_max', value: (r) => round(r.hrcRange[1], 1) },
  { header: 'angle_min_deg_per_side', value: (r) => round(r.angleRange[0], 2) },
  { header: 'angle_max_deg_per_side', value: (r) => round(r.angleRange[1], 2) },
];

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}

/** The plain-words marks of a thin cell ("few results; one tester"), or "". */
export function marks(r: Pick<CompareRow, 'fewResults' | 'singleTester'>): string {
  return [r.fewResults ? 'few results' : '', r.singleTester ? 'one tester' : ''].filter(Boolean).join('; ');
}

/**
 * The view as CSV (RFC 4180, CRLF line ends): comment lines starting with "#" (licence,
 * citation, method versions, units), then the header row and one row per cell. Read it with
 * a CSV reader that skips "#" comment lines (papaparse: `comments: '#'`).
 */
export function comparisonCsv(rows: readonly CompareRow[], ctx: ExportContext): string {
  const header = [
    `# Edgeledger comparison export. Licence: ${EXPORT_LICENCE.name} (${EXPORT_LICENCE.title}), ${EXPORT_LICENCE.url}`,
    `# Cite as: ${citationLine(ctx)}`,
    `# Method versions: ${methodsLine(ctx)}`,
    `# Filters: ${ctx.filters ? oneLine(ctx.filters) : 'none'}; grit bands ${ctx.step} φ wide (φ = -log2(d / 1 mm)).`,
    '# Sharpness in grams of force to sever the method\'s test medium (lower is keener); each result counts once, with the median of its readings.',
  ].map((line) => neutraliseFormula(line.replace(/[\r\n]+/g, ' ')));
  const body = toCsv([EXPORT_COLUMNS.map((c) => c.header), ...rows.map((r) => EXPORT_COLUMNS.map((c) => c.value(r)))]);
  return `${header.join('\r\n')}\r\n${body}`;
}

/** The view as a JSON document: licence, citation, URL, date, methods, filters and the rows. */
export function comparisonJson(rows: readonly CompareRow[], ctx: ExportContext) {
  return {
    licence: EXPORT_LICENCE,
    citation: citationLine(ctx),
    url: ctx.url,
    retrievedOn: ctx.retrievedOn,
    methods: ctx.methods,
    filters: ctx.filters,
    bandStepPhi: ctx.step,
    units: { sharpness: 'grams of force (median of each result\'s readings)', retention: 'cuts', hardness: 'HRC', angle: 'degrees per side', particleSize: 'µm' },
    columns: EXPORT_COLUMNS.map((c) => c.header),
    rows: rows.map((r) => Object.fromEntries(EXPORT_COLUMNS.map((c) => [c.header, c.value(r)]))),
  };
}
