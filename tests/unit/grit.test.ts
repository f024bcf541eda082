import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  GRIT_STANDARDS,
  GRIT_STANDARD_LABELS,
  formatGrade,
  formatMicrometres,
  gradeSpan,
  gradesOf,
  gritBand,
  gritBandPhi,
  nearestGrade,
  nearestGrades,
  parseGrit,
  superabrasiveRanges,
  type GritStandard,
} from '@shared/grit';
import { computationError } from '../setup/computation-error';

describe('FEPA F microgrits: ds50 by sedimentation', () => {
  // FEPA 42-2:2006 / ISO 8486-2:2007, ds50 in µm (from memory)
  it.each([
    ['F230', 53.0],
    ['F240', 44.5],
    ['F280', 36.5],
    ['F320', 29.2],
    ['F360', 22.8],
    ['F400', 17.3],
    ['F500', 12.8],
    ['F600', 9.3],
    ['F800', 6.5],
    ['F1000', 4.5],
    ['F1200', 3.0],
    ['F1500', 2.0],
    ['F2000', 1.2],
  ])('%s → %f µm', (grade, um) => {
    const g = parseGrit(grade);
    expect(g).toMatchObject({ standard: 'fepa-f', grade, inferred: false, basis: 'ds50' });
    expect(g.micrometres).toBe(um);
  });
});

describe('FEPA F macrogrits: geometric middle of the 80 % sieve band', () => {
  // FEPA 42-D-1986 sieve sets (R): the band holding 80 % of the grains, in mm
  it.each([
    ['F24', 0.6, 0.85],
    ['F36', 0.425, 0.6],
    ['F46', 0.3, 0.425],
    ['F60', 0.212, 0.3],
    ['F80', 0.15, 0.212],
    ['F100', 0.106, 0.15],
    ['F120', 0.09, 0.125],
    ['F150', 0.063, 0.106],
    ['F180', 0.063, 0.09],
    ['F220', 0.053, 0.075],
  ])('%s lies in its 80 %% band %f–%f mm, at its geometric middle', (grade, loMm, hiMm) => {
    const g = parseGrit(grade);
    expect(g).toMatchObject({ standard: 'fepa-f', basis: 'sieve-band' });
    expect(g.micrometres).toBeGreaterThan(loMm * 1000);
    expect(g.micrometres).toBeLessThan(hiMm * 1000);
    expect(g.micrometres).toBeCloseTo(1000 * Math.sqrt(loMm * hiMm), 9);
  });

  // FEPA 42-1:2006 grade list, F4 coarsest (from memory)
  it('runs from F4 to F2000 and refuses other grades with the range in the message', () => {
    const grades = gradesOf('fepa-f').map((g) => g.grade);
    expect(grades[0]).toBe('F4');
    expect(grades[grades.length - 1]).toBe('F2000');
    const err = computationError(() => parseGrit('F9999'));
    expect(err.message).toBe('"F9999" is not an FEPA F grit; FEPA F runs from F4 to F2000');
    expect(err.field).toBe('grade');
    expect(computationError(() => parseGrit('F25')).message).toMatch(/nearest grades are F24 and F30/);
  });
});

describe('FEPA P (coated abrasives)', () => {
  // ISO 6344-2:1998 macro averages (R, P150–P220 from memory); ISO 6344-3:2013 micro ds50
  // (P400 and P600 R, the rest from memory)
  it.each([
    ['P12', 1815],
    ['P16', 1324],
    ['P20', 1000],
    ['P24', 764],
    ['P30', 642],
    ['P36', 538],
    ['P40', 425],
    ['P50', 336],
    ['P60', 269],
    ['P80', 201],
    ['P100', 162],
    ['P120', 125],
    ['P150', 100],
    ['P180', 82],
    ['P220', 68],
    ['P240', 58.5],
    ['P280', 52.2],
    ['P320', 46.2],
    ['P360', 40.5],
    ['P400', 35.0],
    ['P500', 30.2],
    ['P600', 25.8],
    ['P800', 21.8],
    ['P1000', 18.3],
    ['P1200', 15.3],
    ['P1500', 12.6],
    ['P2000', 10.3],
    ['P2500', 8.4],
  ])('%s → %f µm', (grade, um) => {
    expect(parseGrit(grade)).toMatchObject({ standard: 'fepa-p', grade, micrometres: um });
  });
});

describe('JIS R6001', () => {
  // JIS R6001:1987 fine grits, ds50 by electrical resistance (JIS R6002) (R)
  it.each([
    ['#240', 57.0],
    ['#280', 48.0],
    ['#320', 40.0],
    ['#360', 35.0],
    ['#400', 30.0],
    ['#500', 25.0],
    ['#600', 20.0],
    ['#700', 17.0],
    ['#800', 14.0],
    ['#1000', 11.5],
    ['#1200', 9.5],
    ['#1500', 8.0],
    ['#2000', 6.7],
    ['#2500', 5.5],
    ['#3000', 4.0],
    ['#4000', 3.0],
    ['#6000', 2.0],
    ['#8000', 1.2],
  ])('%s → %f µm', (grade, um) => {
    expect(parseGrit(grade)).toMatchObject({ standard: 'jis', grade, micrometres: um, inferred: false });
  });

  // JIS R6001 macrogrits use the FEPA sieve sets for the sizes they share (R); grade list (from memory)
  it.each(['24', '36', '46', '60', '80', '100', '120', '150', '180', '220'])('JIS #%s has the size of FEPA F%s', (n) => {
    expect(parseGrit(`JIS ${n}`).micrometres).toBe(parseGrit(`F${n}`).micrometres);
  });
});

describe('JIS R6001 coarse series, checked against the published comparison', () => {
  // UAMA, "National and International Size Standards" (uama.org, Abrasives 101) (R): ANSI B74.12-2001,
  // FEPA 43-1984 R1991 and JIS R6001-1987 have identical sieve requirements for the macrogrits each
  // defines; FEPA alone has F22 and F40; JIS does not cover 4, 5, 6 and 7. Covered: which coarse
  // grades JIS has and that each shares FEPA's sieves (not the openings themselves, nor later editions).
  const fepaMacro = gradesOf('fepa-f')
    .filter((g) => g.micrometres > 60)
    .map((g) => Number(g.grade.slice(1)));
  const jisCoarse = gradesOf('jis')
    .map((g) => ({ n: Number(g.grade.slice(1)), um: g.micrometres }))
    .filter((g) => g.n <= 220);

  it('is FEPA F macro less 4, 5, 6, 7, 22 and 40', () => {
    expect(jisCoarse.map((g) => g.n).sort((a, b) => a - b)).toEqual(fepaMacro.filter((n) => ![4, 5, 6, 7, 22, 40].includes(n)).sort((a, b) => a - b));
  });

  it('every JIS coarse grade takes the FEPA sieve set of its number', () => {
    for (const { n, um } of jisCoarse) expect(um).toBe(parseGrit(`F${n}`).micrometres);
  });

  it.each(['JIS 4', 'JIS 22', 'JIS 40'])('refuses %s, a size JIS R6001 does not define', (text) => {
    expect(computationError(() => parseGrit(text)).field).toBe('grade');
  });
});

describe('ANSI B74.12 / B74.10 (bonded: grinding wheels), its own standard beside coated B74.18', () => {
  // UAMA (R): B74.12 macrogrits share FEPA's sieve requirements; FEPA alone has F22 and F40.
  it.each(['24', '36', '46', '60', '80', '100', '120', '150', '180', '220'])('ANSI bonded %s has the size of FEPA F%s', (n) => {
    expect(parseGrit(n, 'ansi-bonded')).toMatchObject({ standard: 'ansi-bonded', grade: n, micrometres: parseGrit(`F${n}`).micrometres });
  });

  it.each(['22', '40'])('has no %s (FEPA only)', (n) => {
    expect(computationError(() => parseGrit(n, 'ansi-bonded')).message).toMatch(/not an ANSI B74.12 \/ B74.10 grit/);
  });

  it('a bonded wheel marked 600 lands in its own band, not the coated table\'s', () => {
    // bonded 600 ≈ 12.8 µm (B74.10, from memory, low confidence); coated 600 ≈ 16.0 µm (B74.18, from memory)
    const bonded = parseGrit('600', 'ansi-bonded');
    const coated = parseGrit('600', 'ansi');
    expect(bonded.lowConfidence).toBe(true);
    expect(Math.abs(bonded.micrometres - 12.8) / 12.8).toBeLessThanOrEqual(0.1);
    expect(gritBand(bonded.micrometres)).toEqual({ loUm: 7.8125, hiUm: 15.625 });
    expect(gritBand(coated.micrometres)).toEqual({ loUm: 15.625, hiUm: 31.25 });
  });

  it.each<[string, GritStandard | undefined]>([
    ['ANSI bonded 600', undefined],
    ['B74.12 600', undefined],
    ['ANSI B74.10 600', undefined],
    ['600 bonded', undefined],
    ['ANSI 600', 'ansi-bonded'],
  ])('reads "%s" as bonded', (text, standard) => {
    expect(parseGrit(text, standard)).toMatchObject({ standard: 'ansi-bonded', grade: '600' });
  });

  it('"ANSI 600" alone and "ANSI B74.18 600" stay coated; "B126" stays ISO 6106', () => {
    expect(parseGrit('ANSI 600').standard).toBe('ansi');
    expect(parseGrit('ANSI B74.18 600').standard).toBe('ansi');
    expect(parseGrit('B126').standard).toBe('iso6106');
  });

  it('is written with its system', () => {
    expect(formatGrade({ standard: 'ansi-bonded', grade: '600' })).toBe('ANSI 600 (bonded)');
  });
});

describe('thousands separators', () => {
  it.each<[string, GritStandard | undefined, GritStandard, string]>([
    ['1,000', undefined, 'jis', '#1000'],
    ['1 000', undefined, 'jis', '#1000'],
    ['1\u00a0000', undefined, 'jis', '#1000'],
    ['1\u202f000', undefined, 'jis', '#1000'],
    ["1'000", undefined, 'jis', '#1000'],
    ['#1,000', undefined, 'jis', '#1000'],
    ['JIS 6,000', undefined, 'jis', '#6000'],
    ['F1,000', undefined, 'fepa-f', 'F1000'],
    ['1,000', 'fepa-p', 'fepa-p', 'P1000'],
    ['1 200 grit', 'ansi-bonded', 'ansi-bonded', '1200'],
  ])('"%s" (%s) → %s %s', (text, standard, expected, grade) => {
    // by hand: the separator groups thousands, as written in English and French usage
    expect(parseGrit(text, standard)).toMatchObject({ standard: expected, grade });
  });

  it('a size "1,000 µm" is a thousand micrometres, not 1 µm; decimal commas still read as decimals', () => {
    expect(parseGrit('1,000 µm').micrometres).toBe(1000);
    expect(parseGrit('1 000 µm').micrometres).toBe(1000);
    expect(parseGrit('1,000.5 µm').micrometres).toBe(1000.5);
    expect(parseGrit('1,5 µm').micrometres).toBe(1.5);
    expect(parseGrit('0,125 µm').micrometres).toBe(0.125);
  });

  it('a grade that is not one is refused with the right message, not "whole numbers"', () => {
    expect(computationError(() => parseGrit('1,100')).message).toMatch(/"1,100" is not a JIS R6001 grit.*#1000 and #1200/);
    expect(computationError(() => parseGrit('400 600')).message).toMatch(/not a grit we can read/);
  });
});

describe('ANSI B74.18 (coated)', () => {
  // ANSI B74.18 macrogrit averages (R)
  it.each([
    ['16', 1320],
    ['20', 905],
    ['24', 715],
    ['30', 638],
    ['36', 535],
    ['40', 428],
    ['50', 351],
    ['60', 268],
    ['80', 192],
    ['100', 141],
  ])('ANSI %s → %f µm', (grade, um) => {
    expect(parseGrit(`ANSI ${grade}`)).toMatchObject({ standard: 'ansi', grade, micrometres: um });
  });

  // ANSI B74.18 microgrits (from memory, low confidence: copies disagree by a few µm), so within 10 %
  it.each([
    ['240', 53.5],
    ['320', 36],
    ['360', 28.8],
    ['400', 23.6],
    ['500', 19.7],
    ['600', 16.0],
    ['800', 12.2],
    ['1000', 9.2],
  ])('ANSI %s ≈ %f µm and is flagged low confidence', (grade, um) => {
    const g = parseGrit(grade, 'ansi');
    expect(Math.abs(g.micrometres - um) / um).toBeLessThanOrEqual(0.1);
    expect(g.lowConfidence).toBe(true);
  });
});

describe('US standard sieves (ASTM E11-17 openings)', () => {
  // ASTM E11-17, nominal opening in µm (R; No. 4 and No. 5 from memory); ISO 3310-1:2016 agrees
  it.each([
    [4, 4750],
    [5, 4000],
    [6, 3350],
    [7, 2800],
    [8, 2360],
    [10, 2000],
    [12, 1700],
    [14, 1400],
    [16, 1180],
    [18, 1000],
    [20, 850],
    [25, 710],
    [30, 600],
    [35, 500],
    [40, 425],
    [45, 355],
    [50, 300],
    [60, 250],
    [70, 212],
    [80, 180],
    [100, 150],
    [120, 125],
    [140, 106],
    [170, 90],
    [200, 75],
    [230, 63],
    [270, 53],
    [325, 45],
    [400, 38],
    [450, 32],
    [500, 25],
    [635, 20],
  ])('No. %i opens %i µm', (n, um) => {
    expect(parseGrit(`${n} mesh`)).toMatchObject({ standard: 'mesh', grade: `No. ${n}`, micrometres: um, basis: 'sieve-opening' });
  });

  it('"1000 mesh" is read as a US mesh sieve, finer than any ASTM E11 sieve, and says so', () => {
    // ASTM E11-17: the finest sieve is No. 635 (R)
    const err = computationError(() => parseGrit('1000 mesh'));
    expect(err.field).toBe('grade');
    expect(err.message).toMatch(/finer than any ASTM E11 sieve/);
    expect(err.message).toMatch(/No\. 635/);
    expect(err.message).toMatch(/JIS 1000/);
  });
});

describe('Superabrasives (ISO 6106:2013)', () => {
  // ISO 6106:2013, table of designations: designation, US mesh, sieve apertures µm (R)
  it.each([
    ['301', '50/60', 300, 250, false],
    ['251', '60/70', 250, 212, false],
    ['252', '60/80', 250, 180, true],
    ['213', '70/80', 212, 180, false],
    ['181', '80/100', 180, 150, false],
    ['151', '100/120', 150, 125, false],
    ['126', '120/140', 125, 106, false],
    ['107', '140/170', 106, 90, false],
    ['91', '170/200', 90, 75, false],
    ['76', '200/230', 75, 63, false],
    ['64', '230/270', 63, 53, false],
    ['54', '270/325', 53, 45, false],
    ['46', '325/400', 45, 38, false],
  ])('D/B%s is %s mesh, %i/%i µm', (n, mesh, upper, lower, wide) => {
    const mean = (upper + lower) / 2; // representative size chosen: mean of the two apertures
    expect(parseGrit(`D${n}`)).toMatchObject({ standard: 'iso6106', grade: `D${n}`, micrometres: mean });
    expect(parseGrit(`B${n}`)).toMatchObject({ standard: 'iso6106', grade: `B${n}`, micrometres: mean });
    expect(parseGrit(mesh)).toMatchObject({ standard: 'iso6106', grade: `D/B${n}`, micrometres: mean });
    expect(superabrasiveRanges().find((r) => r.designation === `D/B${n}`)).toEqual({
      designation: `D/B${n}`,
      meshPair: mesh,
      upperUm: upper,
      lowerUm: lower,
      wide,
    });
  });

  // ISO 6106:2013: designation = upper aperture + 1 (narrow) or + 2 (wide) (from memory; fits every row)
  it('every designation number is its upper aperture + 1, or + 2 for a wide range', () => {
    for (const r of superabrasiveRanges()) {
      expect(Number(r.designation.slice(3))).toBe(r.upperUm + (r.wide ? 2 : 1));
      // each aperture is an ASTM E11 opening, and the mesh pair names those sieves (ASTM E11-17, R)
      const [coarse, fine] = r.meshPair.split('/');
      expect(parseGrit(`${fine} mesh`).micrometres).toBe(r.lowerUm);
      expect(parseGrit(`No. ${coarse}`).micrometres).toBe(r.upperUm);
    }
  });
});

describe('parseGrit reads what people type', () => {
  it.each<[string, GritStandard | undefined, GritStandard, string, boolean]>([
    ['F400', undefined, 'fepa-f', 'F400', false],
    ['fepa f400', undefined, 'fepa-f', 'F400', false],
    [' F 400 ', undefined, 'fepa-f', 'F400', false],
    ['P1500', undefined, 'fepa-p', 'P1500', false],
    ['FEPA P1500', undefined, 'fepa-p', 'P1500', false],
    ['#6000', undefined, 'jis', '#6000', false],
    ['JIS 1000', undefined, 'jis', '#1000', false],
    ['JIS #1000', undefined, 'jis', '#1000', false],
    ['1000 JIS', undefined, 'jis', '#1000', false],
    ['1000', undefined, 'jis', '#1000', true],
    ['1000 grit', undefined, 'jis', '#1000', true],
    ['ANSI 400', undefined, 'ansi', '400', false],
    ['400 mesh', undefined, 'mesh', 'No. 400', false],
    ['mesh 400', undefined, 'mesh', 'No. 400', false],
    ['No. 400', undefined, 'mesh', 'No. 400', false],
    ['D46', undefined, 'iso6106', 'D46', false],
    ['d 46', undefined, 'iso6106', 'D46', false],
    ['B126', undefined, 'iso6106', 'B126', false],
    ['D/B126', undefined, 'iso6106', 'D/B126', false],
    ['140/170', undefined, 'iso6106', 'D/B107', false],
    ['140/170 mesh', undefined, 'iso6106', 'D/B107', false],
    ['15 µm', undefined, 'um', '15 µm', false],
    ['15 μm', undefined, 'um', '15 µm', false], // Greek mu, as phones type it
    ['15um', undefined, 'um', '15 µm', false],
    ['15 micron', undefined, 'um', '15 µm', false],
    ['15 microns', undefined, 'um', '15 µm', false],
    ['0.5 µm', undefined, 'um', '0.5 µm', false],
    ['2,5 µm', undefined, 'um', '2.5 µm', false],
    // with a standard chosen, a bare number (or "#n") is read in that standard
    ['400', 'fepa-f', 'fepa-f', 'F400', false],
    ['400', 'fepa-p', 'fepa-p', 'P400', false],
    ['400', 'ansi', 'ansi', '400', false],
    ['#400', 'mesh', 'mesh', 'No. 400', false],
    ['46', 'iso6106', 'iso6106', 'D/B46', false],
    ['15', 'um', 'um', '15 µm', false],
    ['1000', 'jis', 'jis', '#1000', false],
    ['F400', 'fepa-f', 'fepa-f', 'F400', false],
  ])('%j (standard %s) → %s %s, inferred %s', (text, standard, expectedStandard, grade, inferred) => {
    expect(parseGrit(text, standard)).toMatchObject({ standard: expectedStandard, grade, inferred });
  });

  it.each<[string, GritStandard | undefined, RegExp]>([
    ['', undefined, /type a grit/],
    ['   ', undefined, /type a grit/],
    ['abc', undefined, /not a grit we can read/],
    ['F', undefined, /not a grit we can read/],
    ['1100', undefined, /not a JIS R6001 grit \(a bare number is read as JIS.*nearest grades are #1000 and #1200/],
    ['P9999', undefined, /not an FEPA P grit; FEPA P runs from P12 to P2500/],
    ['ANSI 1234', undefined, /not an ANSI B74.18 grit/],
    ['33 mesh', undefined, /not an ASTM E11 sieve; US mesh \(ASTM E11\) runs from No\. 4 to No\. 635; the nearest grades are No\. 30 and No\. 35/],
    ['D100', undefined, /not an ISO 6106 designation.*nearest grades are D\/B91 and D\/B107/],
    ['140/160', undefined, /not an ISO 6106 mesh range/],
    ['0 µm', undefined, /outside the sizes we accept/],
    ['20000 µm', undefined, /outside the sizes we accept/],
    ['F400', 'jis', /written as FEPA F, but the standard chosen is JIS R6001/],
    ['15 µm', 'fepa-p', /written as µm/],
    ['12.5', 'jis', /grades are whole numbers/],
  ])('%j (standard %s) is refused: %s', (text, standard, message) => {
    const err = computationError(() => parseGrit(text, standard));
    expect(err.field).toBe('grade');
    expect(err.message).toMatch(message);
  });

  it('refuses an unknown standard naming the standard field', () => {
    const err = computationError(() => parseGrit('400', 'grit' as GritStandard));
    expect(err.field).toBe('standard');
  });
});

describe('gritBand: Krumbein φ classes', () => {
  // Krumbein's φ = −log2(d / 1 mm); whole-φ classes are Wentworth's (1922) size classes, whose
  // limits are powers of two in mm, e.g. very fine sand 1/16–1/8 mm (from memory)
  it.each([
    [10, 1, 7.8125, 15.625],
    [15.625, 1, 7.8125, 15.625], // an edge belongs to the band it is the coarse edge of
    [7.8125, 1, 3.90625, 7.8125],
    [100, 1, 62.5, 125],
    [1000, 1, 500, 1000], // coarse sand, 0.5–1 mm
    [1500, 1, 1000, 2000], // very coarse sand, 1–2 mm
    [0.3, 1, 0.244140625, 0.48828125],
    [10, 0.5, 7.8125, 15.625 / Math.SQRT2],
    [12, 0.5, 15.625 / Math.SQRT2, 15.625],
  ])('%f µm in %s-φ steps → %f–%f µm', (um, step, lo, hi) => {
    const band = gritBand(um, step as 1 | 0.5);
    expect(band.loUm).toBeCloseTo(lo, 10);
    expect(band.hiUm).toBeCloseTo(hi, 10);
  });

  it('whole-φ bands have exact power-of-two edges (mm) around the size, a factor of 2 wide', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.05, max: 5000, noNaN: true }), (um) => {
        const { loUm, hiUm } = gritBand(um);
        expect(loUm).toBeLessThan(um * (1 + 1e-12));
        expect(um).toBeLessThanOrEqual(hiUm * (1 + 1e-12));
        expect(hiUm).toBe(2 * loUm);
        expect(Number.isInteger(Math.log2(hiUm / 1000))).toBe(true);
        expect(gritBandPhi(um)).toBe(-Math.log2(hiUm / 1000));
      }),
    );
  });

  it.each([0, -1, Number.NaN, Infinity])('refuses %f µm', (um) => {
    expect(computationError(() => gritBand(um)).field).toBe('micrometres');
  });
});

describe('nearest grades', () => {
  it('11.5 µm (JIS #1000) in every standard', () => {
    // nearest by ratio among the tables above; US mesh and ISO 6106 sieves stop at 20 µm and 38 µm
    expect(nearestGrades(11.5)).toEqual({
      'fepa-f': 'F500', // 12.8 µm
      'fepa-p': 'P1500', // 12.6 µm
      jis: '#1000',
      ansi: '800', // 12.2 µm
      'ansi-bonded': '600', // 12.8 µm
      mesh: null,
      iso6106: null,
      um: '11.5 µm',
    });
  });

  it('is null outside a standard’s span and a grade at its ends', () => {
    expect(nearestGrade(1.2, 'jis')?.grade).toBe('#8000');
    expect(nearestGrade(0.5, 'jis')).toBeNull();
    expect(nearestGrade(20000, 'fepa-f')).toBeNull();
    expect(nearestGrade(4750, 'mesh')?.grade).toBe('No. 4');
    const span = gradeSpan('mesh');
    expect(nearestGrade(span.minUm * 0.999, 'mesh')).toBeNull();
    expect(nearestGrade(span.maxUm * 1.001, 'mesh')).toBeNull();
  });

  it('round-trips grade → µm → nearest grade for every grade of every standard', () => {
    for (const standard of GRIT_STANDARDS) {
      for (const { grade, micrometres } of gradesOf(standard)) {
        const parsed = parseGrit(grade, standard);
        expect(parsed.micrometres).toBe(micrometres);
        expect(nearestGrade(parsed.micrometres, standard)?.grade).toBe(grade);
      }
    }
  });

  it('property: a grade’s own notation names its standard (except ANSI, which needs it chosen)', () => {
    const grades = GRIT_STANDARDS.filter((s) => s !== 'ansi' && s !== 'ansi-bonded').flatMap((s) => gradesOf(s).map((g) => ({ s, ...g })));
    fc.assert(
      fc.property(fc.constantFrom(...grades), ({ s, grade, micrometres }) => {
        const parsed = parseGrit(grade);
        expect(parsed.standard).toBe(s);
        expect(parsed.micrometres).toBe(micrometres);
        expect(nearestGrade(parsed.micrometres, s)?.grade).toBe(grade);
      }),
    );
  });

  it('property: the nearest grade is nearest by ratio, and is its own nearest grade', () => {
    const standards = GRIT_STANDARDS.filter((s) => s !== 'um');
    fc.assert(
      fc.property(fc.constantFrom(...standards), fc.double({ min: 0.5, max: 6000, noNaN: true }), (standard, um) => {
        const near = nearestGrade(um, standard);
        const span = gradeSpan(standard);
        if (um < span.minUm || um > span.maxUm) {
          expect(near).toBeNull();
          return;
        }
        expect(near).not.toBeNull();
        const distance = Math.abs(Math.log(near!.micrometres / um));
        for (const g of gradesOf(standard)) expect(distance).toBeLessThanOrEqual(Math.abs(Math.log(g.micrometres / um)) + 1e-12);
        expect(nearestGrade(near!.micrometres, standard)?.grade).toBe(near!.grade);
      }),
    );
  });

  it('property: plain micrometres round-trip through parse and nearest', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 9999 }), (n) => {
        const g = parseGrit(`${n} µm`);
        expect(g.micrometres).toBe(n);
        expect(nearestGrade(g.micrometres, 'um')?.grade).toBe(g.grade);
      }),
    );
  });

  it('every ladder is strictly coarse to fine, and grade numbers rise with fineness', () => {
    for (const standard of GRIT_STANDARDS) {
      const rows = gradesOf(standard);
      for (let i = 1; i < rows.length; i++) {
        expect(rows[i].micrometres).toBeLessThan(rows[i - 1].micrometres);
        const [a, b] = [rows[i - 1], rows[i]].map((r) => Number(/\d+/.exec(r.grade)![0]));
        // ISO 6106 numbers follow the upper aperture, so wide ranges interleave: only µm must order them
        if (standard !== 'iso6106') expect(b).toBeGreaterThan(a);
      }
    }
  });
});

describe('facts of the trade', () => {
  it('a dressable vitrified aluminium-oxide wheel spans about grit 200 to 1000: at least 2 grit bands apart', () => {
    // (common practice) such wheels are dressed coarse (about 200) or fine (about 1000); JIS has no
    // #200, so compare #220 and US mesh No. 200 with JIS #1000
    const fine = gritBandPhi(parseGrit('1000').micrometres);
    for (const coarse of [parseGrit('220'), parseGrit('200 mesh')]) {
      expect(fine - gritBandPhi(coarse.micrometres)).toBeGreaterThanOrEqual(2);
    }
  });

  it('a bare number is read as JIS, the usual marking on sharpening stones, and flagged inferred', () => {
    // (common practice) water stones and vitrified wheels are usually marked by JIS R6001 numbers
    expect(parseGrit('6000')).toMatchObject({ standard: 'jis', micrometres: 2.0, inferred: true });
  });
});

describe('formatting', () => {
  it.each<[GritStandard, string, string]>([
    ['fepa-f', 'F400', 'FEPA F400'],
    ['fepa-p', 'P1500', 'FEPA P1500'],
    ['jis', '#1000', 'JIS #1000'],
    ['ansi', '400', 'ANSI 400'],
    ['mesh', 'No. 400', 'US mesh No. 400'],
    ['iso6106', 'D/B107', 'D/B107 (140/170 mesh)'],
    ['iso6106', 'D46', 'D46 (325/400 mesh)'],
    ['um', '15 µm', '15 µm'],
  ])('%s %s → %s', (standard, grade, text) => {
    expect(formatGrade({ standard, grade })).toBe(text);
  });

  it.each([
    [714.142842854285, '714 µm'],
    [17.3, '17.3 µm'],
    [1.2, '1.2 µm'],
    [57, '57 µm'],
    [1815, '1815 µm'],
  ])('%f µm → %s', (um, text) => {
    expect(formatMicrometres(um)).toBe(text);
  });

  it('labels every standard', () => {
    for (const s of GRIT_STANDARDS) expect(GRIT_STANDARD_LABELS[s]).toMatch(/\S/);
  });
});
