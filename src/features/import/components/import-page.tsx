import { useId, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { IMPORT_COLUMN_HELP, IMPORT_COLUMNS, importErrorsCsv, REQUIRED_COLUMNS } from '@shared/csv';
import { importLimits } from '@shared/schemas/import';
import { paths } from '@/config/paths';
import { useUser, useCan } from '@/lib/auth';
import { Button, buttonClasses } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { PageTitle } from '@/components/ui/page-title';
import { describeError } from '@/components/ui/states';
import { checkImport, importResults, IMPORT_TEMPLATE_URL, reportOf, type ImportDone, type ImportReport } from '../api/import-results';
import { ProgressBar } from './progress-bar';

/** Errors shown on the page; the downloadable report holds all of them. */
const SHOWN_ERRORS = 200;

type Step = { kind: 'idle' } | { kind: 'sending'; what: 'check' | 'import'; sent: number } | { kind: 'checked'; report: ImportReport } | { kind: 'done'; done: ImportDone } | { kind: 'failed'; message: string; report?: ImportReport };

function downloadErrors(report: ImportReport) {
  const blob = new Blob([importErrorsCsv(report.errors)], { type: 'text/csv;charset=utf-8' });
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = 'import-errors.csv';
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

function Report({ report }: { report: ImportReport }) {
  const bad = report.errors.length;
  return (
    <section aria-labelledby="dry-run" className="flex flex-col gap-4">
      <h2 id="dry-run" className="text-xl font-semibold">
        Check of the file
      </h2>
      <p role="status">
        {report.rows} row{report.rows === 1 ? '' : 's'} read, {report.valid} valid
        {bad ? `, ${bad} problem${bad === 1 ? '' : 's'} found: nothing can be imported until every row is right.` : ': every row is ready to import.'}
      </p>
      {report.ignoredColumns.length ? <p className="text-sm text-muted">Columns ignored (not recognised): {report.ignoredColumns.join(', ')}.</p> : null}
      {bad ? (
        <>
          <div className="overflow-x-auto rounded-md border border-rule bg-panel">
            <table className="w-full border-collapse text-sm">
              <caption className="px-3 py-2 text-left text-muted">
                Problems by row (the header is row 1, as in a spreadsheet){bad > SHOWN_ERRORS ? `; the first ${SHOWN_ERRORS} of ${bad} are shown` : ''}.
              </caption>
              <thead>
                <tr className="border-b border-rule text-left">
                  <th scope="col" className="px-3 py-1.5">Row</th>
                  <th scope="col" className="px-3 py-1.5">Column</th>
                  <th scope="col" className="px-3 py-1.5">Problem</th>
                </tr>
              </thead>
              <tbody>
                {report.errors.slice(0, SHOWN_ERRORS).map((e, i) => (
                  <tr key={i} className="border-b border-rule/60 last:border-0">
                    <td className="px-3 py-1.5 tabular-nums">{e.row}</td>
                    <td className="px-3 py-1.5 font-mono">{e.column}</td>
                    <td className="px-3 py-1.5">{e.message}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <div>
            <Button variant="secondary" onClick={() => downloadErrors(report)}>
              Download the error report (CSV)
            </Button>
          </div>
        </>
      ) : null}
      {report.preview.length ? (
        // The table's title sits above its scrolling box, so a phone shows it whole rather than cut at the frame.
        <div className="rounded-md border border-rule bg-panel">
          <p id="import-preview-title" className="px-3 py-2 text-sm text-muted">
            How the first rows will be stored: pages matched, hardness in HRC, grit in µm, angle per side, median reading.
          </p>
          <div className="overflow-x-auto">
          <table aria-labelledby="import-preview-title" className="w-full border-collapse text-sm">
            <thead>
              <tr className="border-b border-rule text-left">
                {['Row', 'Steel', 'Abrasive', 'HRC', 'Grit', 'µm', '° per side', 'Median g'].map((h) => (
                  <th key={h} scope="col" className="px-3 py-1.5">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {report.preview.map((p) => (
                <tr key={p.row} className="border-b border-rule/60 last:border-0">
                  <td className="px-3 py-1.5 tabular-nums">{p.row}</td>
                  <td className="px-3 py-1.5">{p.steel}</td>
                  <td className="px-3 py-1.5">{p.abrasive}</td>
                  <td className="px-3 py-1.5 tabular-nums">{p.hrc}</td>
                  <td className="px-3 py-1.5">{p.gritGrade}</td>
                  <td className="px-3 py-1.5 tabular-nums">{p.gritUm}</td>
                  <td className="px-3 py-1.5 tabular-nums">{p.perSideDeg}</td>
                  <td className="px-3 py-1.5 tabular-nums">{p.sharpnessMedianG}</td>
                </tr>
              ))}
            </tbody>
          </table>
          </div>
        </div>
      ) : null}
    </section>
  );
}

function Importer() {
  const fileId = useId();
  const input = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | undefined>();
  const [step, setStep] = useState<Step>({ kind: 'idle' });

  const pick = (f: File | null) => {
    setFile(f);
    setStep({ kind: 'idle' });
    setFileError(f && f.size > importLimits.fileBytesMax ? `The file is larger than ${importLimits.fileBytesMax / (1024 * 1024)} MB; split it into smaller files.` : undefined);
  };

  const run = async (what: 'check' | 'import') => {
    if (!file) {
      setFileError('Choose a CSV file first.');
      return;
    }
    setStep({ kind: 'sending', what, sent: 0 });
    const onProgress = (sent: number) => setStep({ kind: 'sending', what, sent });
    try {
      if (what === 'check') setStep({ kind: 'checked', report: await checkImport(file, onProgress) });
      else setStep({ kind: 'done', done: await importResults(file, onProgress) });
    } catch (error) {
      const report = reportOf(error);
      setStep({ kind: 'failed', message: describeError(error), report: report ?? undefined });
    }
  };

  const report = step.kind === 'checked' ? step.report : step.kind === 'failed' ? step.report : undefined;
  const ready = step.kind === 'checked' && step.report.errors.length === 0 && step.report.valid > 0;

  return (
    <div className="flex flex-col gap-6">
      <form
        aria-label="Import a CSV file"
        className="flex flex-col gap-4 rounded-md border border-rule bg-panel p-4"
        onSubmit={(e) => {
          e.preventDefault();
          void run('check');
        }}
      >
        <Field id={fileId} label="CSV file of results" hint={`UTF-8, comma-separated, at most ${importLimits.rowsMax.toLocaleString('en-GB')} rows.`} error={fileError}>
          <input
            ref={input}
            id={fileId}
            type="file"
            accept=".csv,text/csv"
            aria-invalid={fileError ? true : undefined}
            aria-describedby={`${fileId}-hint${fileError ? ` ${fileId}-error` : ''}`}
            onChange={(e) => pick(e.target.files?.[0] ?? null)}
          />
        </Field>
        <div className="flex flex-wrap gap-2">
          <Button type="submit" variant={ready ? 'secondary' : 'primary'} disabled={!file || !!fileError} busy={step.kind === 'sending' && step.what === 'check'}>
            Check the file
          </Button>
          {ready ? (
            <Button onClick={() => void run('import')}>
              Import {step.report.valid} result{step.report.valid === 1 ? '' : 's'}
            </Button>
          ) : null}
        </div>
        {step.kind === 'sending' ? (
          step.sent < 1 ? (
            <ProgressBar label="Sending the file" value={step.sent} />
          ) : (
            <ProgressBar label={step.what === 'check' ? 'Checking every row…' : 'Storing every row in one go…'} />
          )
        ) : null}
      </form>

      {step.kind === 'failed' ? (
        <p role="alert" className="rounded-md border border-danger/40 bg-danger-soft px-4 py-3 text-danger">
          {step.message}
        </p>
      ) : null}
      {step.kind === 'done' ? (
        <div role="status" className="rounded-md border border-accent/40 bg-accent-soft px-4 py-3">
          <p className="font-semibold">
            Imported {step.done.imported} result{step.done.imported === 1 ? '' : 's'} (import #{step.done.importId}).
          </p>
          <p>
            {step.done.status === 'approved' ? 'They are published now.' : 'They await review by a moderator; you will get one e-mail when they are decided.'}{' '}
            <Link to={paths.myResults.getHref()}>Your page</Link> lists your imports.
          </p>
        </div>
      ) : null}
      {report ? <Report report={report} /> : null}
    </div>
  );
}

/** The columns of the import file, with what each holds. */
function Columns() {
  return (
    <details className="rounded-md border border-rule bg-panel px-4 py-3">
      <summary className="cursor-pointer font-semibold">The columns of the file</summary>
      <dl className="mt-3 grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[14rem_1fr]">
        {IMPORT_COLUMNS.map((c) => (
          <div key={c} className="contents">
            <dt className="font-mono">
              {c}
              {REQUIRED_COLUMNS.includes(c) ? ' *' : ''}
            </dt>
            <dd className="text-muted">{IMPORT_COLUMN_HELP[c]}</dd>
          </div>
        ))}
      </dl>
      <p className="mt-2 text-sm text-muted">* required. Header names are matched without regard to case or punctuation.</p>
    </details>
  );
}

/** Bulk import (publishers): template, dry run with every problem by row and column, then the import. */
export default function ImportPage() {
  const user = useUser();
  const mayImport = useCan('import:results');
  return (
    <div className="flex flex-col gap-6">
      <PageTitle title="Import results" lead="Publish many measured edges at once from a spreadsheet. Nothing is stored until every row passes the same checks as the single-result form.">
        Import results
      </PageTitle>
      <p>
        <a href={IMPORT_TEMPLATE_URL} download className={buttonClasses('secondary', 'sm')}>
          Download the template (CSV)
        </a>{' '}
        <span className="text-sm text-muted">A header row and two invented example lines for the demo pages.</span>
      </p>
      <Columns />
      {!user ? (
        <p className="rounded-md border border-rule bg-panel px-4 py-3">
          <Link to={paths.signIn.getHref(paths.importResults.getHref())}>Sign in</Link> as a publisher to import.
        </p>
      ) : !mayImport ? (
        <p className="rounded-md border border-rule bg-panel px-4 py-3">
          Bulk import is for publishers: verified workshops and labs. You can apply from <Link to={paths.myResults.getHref()}>your page</Link>.
        </p>
      ) : (
        <Importer />
      )}
    </div>
  );
}
