import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { neutraliseFormula, toCsv } from '../../shared/csv-writer';
import { importErrorsCsv } from '../../shared/csv';

// Source of the rule: OWASP, "CSV Injection" (https://owasp.org/www-community/attacks/CSV_Injection):
// fields beginning with = + - @, tab (0x09) or carriage return (0x0D) are evaluated as formulas;
// prefix them with a single quote. The full-width forms (U+FF1D, U+FF0B, U+FF0D, U+FF20) are folded
// to the ASCII ones by spreadsheets that normalise width, so they are neutralised too.
describe('the one CSV writer (shared/csv-writer.ts)', () => {
  it.each([
    ['=HYPERLINK("http://x")', '\'=HYPERLINK("http://x")'],
    ['+1+1', "'+1+1"],
    ['-2+3', "'-2+3"],
    ['@SUM(A1)', "'@SUM(A1)"],
    ['\uFF1D1+1', "'\uFF1D1+1"],
    ['\uFF0B1', "'\uFF0B1"],
    ['\uFF0D1', "'\uFF0D1"],
    ['\uFF20SUM(A1)', "'\uFF20SUM(A1)"],
    ['\tcmd', "'\tcmd"],
    ['\rcmd', "'\rcmd"],
    ['  =1', "'  =1"],
    ['AISI D2', 'AISI D2'],
    ['1.2379', '1.2379'],
    ['61 HRC', '61 HRC'],
  ])('neutralises %j as OWASP "CSV Injection" advises', (input, out) => {
    expect(neutraliseFormula(input)).toBe(out);
  });

  it('writes RFC 4180 CSV that papaparse reads back, with every hostile text cell prefixed and numbers untouched', () => {
    const rows = [
      ['name', 'value', 'ok'],
      ['\uFF1Dcmd|"/c calc"!A1', -3, true],
      ['Steel, "quoted"', 1.5, false],
      ['line\nbreak', Number.NaN, null],
    ];
    const csv = toCsv(rows);
    expect(csv.endsWith('\r\n')).toBe(true);
    expect(csv.split('\r\n')[1]).toBe(`"'\uFF1Dcmd|""/c calc""!A1",-3,yes`);
    const parsed = Papa.parse<string[]>(csv, { skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data).toEqual([
      ['name', 'value', 'ok'],
      ['\'\uFF1Dcmd|"/c calc"!A1', '-3', 'yes'],
      ['Steel, "quoted"', '1.5', 'no'],
      ['line\nbreak', '', ''],
    ]);
  });

  it('writes the import error report through the same rule', () => {
    const csv = importErrorsCsv([{ row: 2, column: 'notes', message: '@cmd is not allowed' }]);
    expect(Papa.parse<string[]>(csv, { skipEmptyLines: true }).data).toEqual([['row', 'column', 'message'], ['2', 'notes', "'@cmd is not allowed"]]);
  });
});
