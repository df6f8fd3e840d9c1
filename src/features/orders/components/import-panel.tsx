import { useState } from 'react';
import { Link } from 'react-router';
import { Trans, useTranslation } from 'react-i18next';
import { AlertTriangle, CheckCircle2, XCircle } from 'lucide-react';
import { IMPORT_COLUMNS, IMPORT_EXAMPLE, type ImportCellError, type ImportPreview } from '@shared/domain/order-import';
import { Card, ErrorPanel, Pill } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';
import { TextAreaField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { errorText } from '@/lib/error-text';
import { useImportOrders, usePreviewImport } from '../api/import-orders';

/** The few columns that say which order a row is; every problem of the other cells is listed beside them. */
const KEY_COLUMNS = ['customer', 'title', 'quantity', 'dueDate'] as const;

function PreviewTable({ preview }: { preview: ImportPreview }) {
  const { t } = useTranslation('orders');
  const cellText = (e: ImportCellError) => t(`import.issue.${e.code}`, e.params);
  return (
    <div className="overflow-x-auto rounded-xl border border-harbour-100 bg-white">
      <table className="w-full table-fixed text-left text-sm">
        <caption className="sr-only">{t('import.rows')}</caption>
        <colgroup>
          <col className="w-14" />
          <col className="w-[42%]" />
          <col />
          <col />
          <col className="w-24" />
          <col className="w-32" />
        </colgroup>
        <thead className="bg-harbour-50">
          <tr>
            <th scope="col" className="px-2 py-2">
              {t('import.row')}
            </th>
            <th scope="col" className="px-2 py-2">
              {t('import.result')}
            </th>
            {KEY_COLUMNS.map((c) => (
              <th key={c} scope="col" className="px-2 py-2">
                {t(`import.columnLabel.${c}`)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {preview.rows.map((r) => (
            <tr key={r.line} className={`border-t border-harbour-100 align-top ${r.spec ? '' : 'bg-stop-50'}`}>
              <td className="px-2 py-2 font-bold">{r.line}</td>
              <td className="px-2 py-2">
                {r.spec ? (
                  <span className="inline-flex items-center gap-1 font-bold text-ok-700">
                    <CheckCircle2 className="h-5 w-5" aria-hidden /> {t('import.willImport')}
                  </span>
                ) : (
                  <span className="inline-flex items-center gap-1 font-bold text-stop-700">
                    <XCircle className="h-5 w-5" aria-hidden /> {t('import.skipped')}
                  </span>
                )}
                {r.errors.length > 0 && (
                  <ul className="mt-1 flex flex-col gap-1 text-stop-700">
                    {r.errors.map((e, k) => (
                      <li key={k} className="break-words">
                        {e.column && <strong>{t(`import.columnLabel.${e.column}`)}: </strong>}
                        {cellText(e)}
                      </li>
                    ))}
                  </ul>
                )}
                {(r.warnings.length > 0 || r.formulaCells.length > 0) && (
                  <ul className="mt-1 flex flex-col gap-1 text-warn-700">
                    {r.warnings.map((w) => (
                      <li key={w.code} className="flex gap-1 break-words">
                        <AlertTriangle className="mt-0.5 h-4 w-4 shrink-0" aria-hidden />
                        {t(`import.warning.${w.code}`, w.params)}
                      </li>
                    ))}
                    {r.formulaCells.map((f, k) => (
                      <li key={`formula-${k}`} role="note" className="break-words">
                        {f.column && <strong>{t(`import.columnLabel.${f.column}`)}: </strong>}
                        {cellText(f)}
                      </li>
                    ))}
                  </ul>
                )}
              </td>
              {KEY_COLUMNS.map((c) => {
                const bad = r.errors.some((e) => e.column === c);
                return (
                  <td key={c} className={`break-words px-2 py-2 ${bad ? 'font-bold text-stop-700' : ''}`}>
                    {r.raw[c]}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** Upload or paste a CSV; a preview names every bad cell; only the valid rows are imported, on confirmation. */
export function ImportPanel() {
  const { t } = useTranslation('orders');
  const [csv, setCsv] = useState('');
  const preview = usePreviewImport();
  const importer = useImportOrders();
  const result = preview.data;
  const warned = result?.rows.filter((r) => r.spec && r.warnings.length > 0).length ?? 0;
  return (
    <div className="flex flex-col gap-6">
      <Card>
        <h2 className="mb-2 text-xl font-bold text-harbour-900">{t('import.step1')}</h2>
        <p className="mb-1 text-harbour-700">
          {t('import.intro')} <code className="break-words">{IMPORT_COLUMNS.join(', ')}</code>
        </p>
        <p className="mb-4 text-harbour-700">
          <Trans t={t} i18nKey="import.introFormat" components={{ code: <code /> }} />
        </p>
        <div className="flex flex-col gap-4">
          <label className="flex flex-col gap-1 text-sm font-bold">
            {t('import.file')}
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
          <TextAreaField label={t('import.paste')} rows={6} value={csv} onChange={(e) => setCsv(e.target.value)} placeholder={IMPORT_EXAMPLE} />
          <div className="flex gap-3">
            <Button
              variant="secondary"
              disabled={!csv.trim() || preview.isPending}
              onClick={() => {
                importer.reset();
                preview.mutate({ csv });
              }}
            >
              {t('import.check')}
            </Button>
            <Button variant="ghost" onClick={() => setCsv(IMPORT_EXAMPLE)}>
              {t('import.example')}
            </Button>
          </div>
        </div>
        {preview.error && (
          <div className="mt-4">
            <ErrorPanel title={t('import.notRead')} message={errorText(preview.error)} />
          </div>
        )}
      </Card>

      {result && (
        <Card>
          <h2 className="mb-2 text-xl font-bold text-harbour-900">{t('import.step2')}</h2>
          {result.fileIssues.length > 0 && (
            <div className="mb-4">
              <ErrorPanel title={t('import.nothing')} message={result.fileIssues.map((f) => t(`import.fileIssue.${f.code}`, f.params)).join(' ')} />
            </div>
          )}
          {result.unknownColumns.length > 0 && (
            <p className="mb-2 text-warn-700">
              {t('import.unknownColumns')} <code className="font-bold">{result.unknownColumns.join(', ')}</code>
            </p>
          )}
          {result.rows.length > 0 && (
            <>
              <p className="mb-4 flex flex-wrap gap-2">
                <Pill tone="ok">{t('import.ready', { count: result.validCount })}</Pill>
                <Pill tone={result.rows.length - result.validCount ? 'stop' : 'neutral'}>
                  {t('import.withErrors', { count: result.rows.length - result.validCount })}
                </Pill>
                {warned > 0 && <Pill tone="warn">{t('import.withWarnings', { count: warned })}</Pill>}
              </p>
              <PreviewTable preview={result} />
            </>
          )}
          {result.validCount > 0 && !importer.data && (
            <div className="mt-4">
              <Button size="lg" disabled={importer.isPending} onClick={() => importer.mutate(csv)}>
                {t('import.importN', { count: result.validCount })}
              </Button>
            </div>
          )}
          {importer.error && (
            <div className="mt-4">
              <ErrorPanel title={t('import.notImported')} message={errorText(importer.error)} />
            </div>
          )}
          {importer.data && (
            <div role="status" className="mt-4 rounded-lg border-2 border-ok-700/40 bg-ok-50 p-4">
              <p className="font-bold text-ok-700">
                {t('import.imported', { count: importer.data.created.length })}
                {importer.data.skipped.length ? ` ${t('import.skippedRows', { rows: importer.data.skipped.join(', ') })}` : ''}
              </p>
              <ul className="mt-2 flex flex-wrap gap-3">
                {importer.data.created.map((c) => (
                  <li key={c.id}>
                    <Link className="font-bold text-harbour-800 underline" to={paths.order(c.id)}>
                      {t('import.orderN', { number: c.number })}
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
