import { useState } from 'react';
import { Link } from 'react-router';
import { CheckCircle2, XCircle } from 'lucide-react';
import { IMPORT_COLUMNS, IMPORT_EXAMPLE, type ImportPreview } from '@shared/domain/order-import';
import { Card, ErrorPanel, Pill } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';
import { TextAreaField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { useImportOrders, usePreviewImport } from '../api/import-orders';

function PreviewTable({ preview }: { preview: ImportPreview }) {
  const shown = IMPORT_COLUMNS.filter((c) => preview.rows.some((r) => c in r.raw));
  return (
    <div className="overflow-x-auto rounded-xl border border-harbour-100 bg-white">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Rows of the file</caption>
        <thead className="bg-harbour-50">
          <tr>
            <th scope="col" className="px-2 py-2">
              Row
            </th>
            <th scope="col" className="px-2 py-2">
              Result
            </th>
            {shown.map((c) => (
              <th key={c} scope="col" className="px-2 py-2">
                {c}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {preview.rows.map((r) => {
            const rowError = r.errors.find((e) => e.column === null);
            return (
              <tr key={r.line} className={`border-t border-harbour-100 ${r.spec ? '' : 'bg-stop-50'}`}>
                <td className="px-2 py-1 font-bold">{r.line}</td>
                <td className="px-2 py-1">
                  {r.spec ? (
                    <span className="inline-flex items-center gap-1 font-bold text-ok-700">
                      <CheckCircle2 className="h-5 w-5" aria-hidden /> Will import
                    </span>
                  ) : (
                    <span className="inline-flex items-center gap-1 font-bold text-stop-700">
                      <XCircle className="h-5 w-5" aria-hidden /> Skipped{rowError ? `: ${rowError.message}` : ''}
                    </span>
                  )}
                  {r.warnings.map((w) => (
                    <div key={w.code} className="text-warn-700">
                      {w.message}
                    </div>
                  ))}
                  {r.formulaCells.map((f, k) => (
                    <div key={`formula-${k}`} role="note" className="text-warn-700">
                      {f.column ? `${f.column}: ` : ''}
                      {f.message}
                    </div>
                  ))}
                </td>
                {shown.map((c) => {
                  const err = r.errors.find((e) => e.column === c);
                  return (
                    <td key={c} className={`px-2 py-1 align-top ${err ? 'font-bold text-stop-700' : ''}`}>
                      {r.raw[c]}
                      {err && (
                        <div role="note" className="text-xs">
                          {err.message}
                        </div>
                      )}
                    </td>
                  );
                })}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

/** Upload or paste a CSV; a preview names every bad cell; only the valid rows are imported, on confirmation. */
export function ImportPanel() {
  const [csv, setCsv] = useState('');
  const preview = usePreviewImport();
  const importer = useImportOrders();
  const result = preview.data;
  return (
    <div className="flex flex-col gap-6">
      <Card>
        <h2 className="mb-2 text-xl font-bold text-harbour-900">1. The file</h2>
        <p className="mb-4 text-harbour-700">
          One order per row, with a header row. Columns: {IMPORT_COLUMNS.join(', ')}. Colours are written like <code>Navy (C-281) #1b2a4a; White</code>; yes/no for back logo,
          printing, epoxy and sandblast; secondPlating names a two-tone badge&rsquo;s second finish (empty for one finish); dates as YYYY-MM-DD. Up to 1 MB and 1000 orders.
        </p>
        <div className="flex flex-col gap-4">
          <label className="flex flex-col gap-1 text-sm font-bold">
            CSV file
            <input
              type="file"
              accept=".csv,text/csv"
              className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white p-2 font-normal"
              onChange={async (e) => {
                const file = e.target.files?.[0];
                if (!file) return;
                importer.reset();
                preview.mutate({ file }, { onSuccess: async () => setCsv(await file.text()) });
              }}
            />
          </label>
          <TextAreaField label="…or paste the rows here" rows={6} value={csv} onChange={(e) => setCsv(e.target.value)} placeholder={IMPORT_EXAMPLE} />
          <div className="flex gap-3">
            <Button
              variant="secondary"
              disabled={!csv.trim() || preview.isPending}
              onClick={() => {
                importer.reset();
                preview.mutate({ csv });
              }}
            >
              Check the rows
            </Button>
            <Button variant="ghost" onClick={() => setCsv(IMPORT_EXAMPLE)}>
              Use the example
            </Button>
          </div>
        </div>
        {preview.error && (
          <div className="mt-4">
            <ErrorPanel title="The file was not read" message={preview.error.message} />
          </div>
        )}
      </Card>

      {result && (
        <Card>
          <h2 className="mb-2 text-xl font-bold text-harbour-900">2. Preview</h2>
          {result.fileErrors.length > 0 && (
            <div className="mb-4">
              <ErrorPanel title="Nothing can be imported from this file" message={result.fileErrors.join(' ')} />
            </div>
          )}
          {result.unknownColumns.length > 0 && (
            <p className="mb-2 text-warn-700">
              Columns not used: <strong>{result.unknownColumns.join(', ')}</strong>
            </p>
          )}
          {result.rows.length > 0 && (
            <>
              <p className="mb-4 flex flex-wrap gap-2">
                <Pill tone="ok">{result.validCount} ready</Pill>
                <Pill tone={result.rows.length - result.validCount ? 'stop' : 'neutral'}>{result.rows.length - result.validCount} with errors</Pill>
              </p>
              <PreviewTable preview={result} />
            </>
          )}
          {result.validCount > 0 && !importer.data && (
            <div className="mt-4">
              <Button size="lg" disabled={importer.isPending} onClick={() => importer.mutate(csv)}>
                Import {result.validCount} order{result.validCount === 1 ? '' : 's'}
              </Button>
            </div>
          )}
          {importer.error && (
            <div className="mt-4">
              <ErrorPanel title="Not imported" message={importer.error.message} />
            </div>
          )}
          {importer.data && (
            <div role="status" className="mt-4 rounded-lg border-2 border-ok-700/40 bg-ok-50 p-4">
              <p className="font-bold text-ok-700">
                Imported {importer.data.created.length} order{importer.data.created.length === 1 ? '' : 's'}
                {importer.data.skipped.length ? `; skipped rows ${importer.data.skipped.join(', ')}` : ''}.
              </p>
              <ul className="mt-2 flex flex-wrap gap-3">
                {importer.data.created.map((c) => (
                  <li key={c.id}>
                    <Link className="font-bold text-harbour-800 underline" to={paths.order(c.id)}>
                      Order {c.number}
                    </Link>
                  </li>
                ))}
              </ul>
            </div>
          )}
        </Card>
      )}
    </div>
  );
}
