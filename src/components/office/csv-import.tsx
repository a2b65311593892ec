// Invite many customers from a CSV file: parsed in the browser, checked by a dry run on the
// server (per-row errors, duplicates in the file and in the database), then created in one go.
import { useId, useState } from 'react';
import Papa from 'papaparse';
import { inviteCsvColumns, inviteFromCsvRow, type InviteInput } from '@/lib/schemas/invite';
import { CheckIcon, SpinnerIcon, StopIcon, WarningIcon } from '@/components/icons';
import { apiCall } from './api';
import { plural } from './format';

type RowResult = { row: number; ok: boolean; email?: string; fields?: Record<string, string>; id?: string };
type DryRun = { ok: boolean; results: RowResult[] };
type Imported = { created: number; results: RowResult[] };

const MAX_ROWS = 500;

// Invented people at example.com addresses, with phone numbers from Ofcom's ranges set aside for drama.
export const exampleCsv = [
  inviteCsvColumns.join(','),
  'Alys Penhallow,alys.penhallow@example.com,0113 496 0101,12 Wren Gardens,,Quillbury,YY1 4DS,Tethered unit wanted',
  'Bram Okonedo,bram.okonedo@example.com,,Flat 4 Larkspur House,Station Road,Quillbury,YY2 5HT,',
  'Corinne Ashby,corinne.ashby@example.com,020 7946 0123,The Granary,Mill Lane,Quillbury,YY1 8EF,Car due next month',
].join('\r\n');

const fieldWords: Record<string, string> = {
  'customer.name': 'Name',
  'customer.email': 'E-mail',
  'customer.phone': 'Phone',
  'address.addressLine1': 'Address line 1',
  'address.addressLine2': 'Address line 2',
  'address.town': 'Town',
  'address.postcode': 'Postcode',
  note: 'Note',
};

type Parsed = { fileName: string; rows: InviteInput[]; problems: string[] };

/** Reads the file's header row and rows; says what is wrong with the file as a whole. */
function parseCsv(file: File): Promise<Parsed> {
  return new Promise((resolve) => {
    Papa.parse<Record<string, string>>(file, {
      header: true,
      skipEmptyLines: 'greedy',
      transformHeader: (h) => h.trim(),
      complete: (result) => {
        const headers = result.meta.fields ?? [];
        const problems: string[] = [];
        const missing = ['name', 'email'].filter((c) => !headers.includes(c));
        if (missing.length) problems.push(`The header row needs the column${missing.length > 1 ? 's' : ''} ${missing.join(' and ')}.`);
        const unknown = headers.filter((h) => !(inviteCsvColumns as readonly string[]).includes(h));
        if (unknown.length) problems.push(`These columns are not used and will be ignored: ${unknown.join(', ')}.`);
        if (result.data.length === 0) problems.push('The file has no rows under the header.');
        if (result.data.length > MAX_ROWS) problems.push(`Import at most ${MAX_ROWS} rows at a time; this file has ${result.data.length}.`);
        resolve({ fileName: file.name, rows: result.data.map(inviteFromCsvRow), problems });
      },
      error: (err) => resolve({ fileName: file.name, rows: [], problems: [`The file could not be read: ${err.message}`] }),
    });
  });
}

export default function CsvImport() {
  const id = useId();
  const [parsed, setParsed] = useState<Parsed | null>(null);
  const [check, setCheck] = useState<DryRun | null>(null);
  const [busy, setBusy] = useState<'checking' | 'importing' | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<Imported | null>(null);

  async function choose(file: File | undefined) {
    setParsed(null);
    setCheck(null);
    setDone(null);
    setError(null);
    if (!file) return;
    const p = await parseCsv(file);
    setParsed(p);
    const fatal = p.rows.length === 0 || p.rows.length > MAX_ROWS || p.problems.some((x) => x.startsWith('The header row'));
    if (fatal) return;
    setBusy('checking');
    const r = await apiCall<DryRun>('POST', '/api/cases/import', { rows: p.rows, dryRun: true });
    setBusy(null);
    if (r.ok) setCheck(r.data);
    else setError(r.error.message);
  }

  async function importAll() {
    if (!parsed) return;
    setBusy('importing');
    setError(null);
    const r = await apiCall<Imported>('POST', '/api/cases/import', { rows: parsed.rows, dryRun: false });
    setBusy(null);
    if (r.ok) {
      setDone(r.data);
      setCheck({ ok: true, results: r.data.results });
      return;
    }
    setError(r.error.message);
    if (Array.isArray(r.error.results)) setCheck({ ok: false, results: r.error.results as RowResult[] });
  }

  const results = check?.results ?? [];
  const bad = results.filter((r) => !r.ok).length;
  const ready = !!check?.ok && !!parsed && !done;

  return (
    <section aria-labelledby="import-heading" className="card">
      <h2 id="import-heading" className="text-xl font-bold text-ground-900">Invite several from a CSV file</h2>
      <p className="text-ground-800">
        One customer per row, with a header row. Columns: <code className="rounded bg-ground-50 px-1 text-sm">{inviteCsvColumns.join(', ')}</code> — only name and e-mail are needed.
        Nothing is sent until every row checks out.
      </p>
      <p className="mt-1 text-sm">
        <a href={`data:text/csv;charset=utf-8,${encodeURIComponent(exampleCsv)}`} download="groundwork-invite-example.csv">Download an example file</a>
      </p>

      <div className="mt-4">
        <label htmlFor={`${id}-file`} className="field-label">CSV file</label>
        <input
          id={`${id}-file`}
          type="file"
          accept=".csv,text/csv"
          className="block w-full text-sm file:mr-3 file:min-h-[44px] file:cursor-pointer file:rounded-md file:border file:border-ground-300 file:bg-white file:px-4 file:font-semibold file:text-ground-800 hover:file:bg-ground-50"
          onChange={(e) => void choose(e.target.files?.[0])}
          data-testid="csv-file"
        />
      </div>

      {parsed && parsed.problems.length > 0 && (
        <ul className="mt-3 space-y-1 rounded-md border border-attention/30 bg-attention-soft p-3 text-sm">
          {parsed.problems.map((p) => <li key={p} className="flex items-start gap-2"><WarningIcon className="mt-0.5 h-4 w-4 text-attention" />{p}</li>)}
        </ul>
      )}
      {busy === 'checking' && <p className="mt-3 flex items-center gap-2 text-sm" role="status"><SpinnerIcon className="h-4 w-4" />Checking {plural(parsed?.rows.length ?? 0, 'row')}…</p>}
      {error && <p role="alert" className="mt-3 rounded-md border border-blocked/30 bg-blocked-soft p-3 font-semibold text-blocked">{error}</p>}

      {parsed && check && (
        <div className="mt-4">
          <p role="status" className={`mb-2 flex items-center gap-2 font-semibold ${bad ? 'text-blocked' : 'text-clear'}`} data-testid="import-summary">
            {bad ? <StopIcon className="h-5 w-5" /> : <CheckIcon className="h-5 w-5" />}
            {bad ? `${bad} of ${plural(results.length, 'row')} need fixing in the file; nothing has been sent.` : `All ${plural(results.length, 'row')} check out.`}
          </p>
          <div className="max-h-[28rem] overflow-auto rounded-md border border-ground-100">
            <table className="w-full text-left text-sm" data-testid="import-preview">
              <caption className="sr-only">Preview of {parsed.fileName}</caption>
              <thead className="sticky top-0 bg-ground-50 text-ground-800">
                <tr>
                  <th scope="col" className="w-12 px-2 py-1.5">Row</th>
                  <th scope="col" className="px-2 py-1.5">Customer</th>
                  <th scope="col" className="px-2 py-1.5">Check</th>
                </tr>
              </thead>
              <tbody>
                {parsed.rows.map((row, i) => {
                  const res = results[i];
                  return (
                    <tr key={i} className={`border-t border-ground-100 align-top ${res && !res.ok ? 'bg-blocked-soft/40' : ''}`}>
                      <td className="px-2 py-1.5 tabular-nums">{i + 1}</td>
                      <td className="min-w-0 px-2 py-1.5">
                        <div className="font-semibold">{row.customer.name || <span className="text-ground-500">No name</span>}</div>
                        <div className="break-all text-ground-700">{row.customer.email || 'No e-mail'}</div>
                        {row.address?.postcode && <div className="text-xs text-ground-600">{row.address.postcode}</div>}
                      </td>
                      <td className="px-2 py-1.5">
                        {res?.ok ? (
                          <span className="inline-flex items-center gap-1 text-clear"><CheckIcon className="h-4 w-4" />{res.id ? <a href={`/office/cases/${res.id}`}>Invited</a> : 'Ready'}</span>
                        ) : (
                          <ul className="text-blocked">
                            {Object.entries(res?.fields ?? {}).map(([k, v]) => (
                              <li key={k} className="flex items-start gap-1"><StopIcon className="mt-0.5 h-4 w-4 shrink-0" /><span><span className="font-semibold">{fieldWords[k] ?? k}:</span> {v}</span></li>
                            ))}
                          </ul>
                        )}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
          <p className="mt-1 text-xs text-ground-600">Rows are counted from the first one under the header.</p>
        </div>
      )}

      {done ? (
        <p role="status" className="mt-4 flex items-center gap-2 rounded-md border border-clear/30 bg-clear-soft p-3 font-semibold" data-testid="import-done">
          <CheckIcon className="h-5 w-5 text-clear" />Invited {plural(done.created, 'customer')}. Their cases are in the queue.
        </p>
      ) : (
        parsed && check && (
          <button type="button" className="btn-primary mt-4" disabled={!ready || busy !== null} onClick={importAll}>
            {busy === 'importing' && <SpinnerIcon className="h-5 w-5" />}
            Invite {plural(results.length, 'customer')}
          </button>
        )
      )}
    </section>
  );
}
