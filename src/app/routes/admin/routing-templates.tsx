import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { ADMIN_ONLY } from '@shared/domain/access';
import { PROCESSES, type Process } from '@shared/domain/vocabulary';
import { queryClient } from '@/lib/query-client';
import { templatesQueryOptions, useTemplates } from '@/features/orders/api/routing';
import { TemplateEditor } from '@/features/orders/components/template-editor';
import { ErrorPanel, Loading, PageHeader } from '@/components/ui/panels';

export const handle = { roles: ADMIN_ONLY };
export const loader = () => queryClient.ensureQueryData(templatesQueryOptions());

export function Component() {
  const { t } = useTranslation(['admin', 'common']);
  const templates = useTemplates();
  const [process, setProcess] = useState<Process>('hard_enamel');
  const current = templates.data?.find((x) => x.process === process);
  return (
    <>
      <PageHeader
        title={t('templates.title')}
        subtitle={t('templates.subtitle')}
        actions={
          <label className="flex flex-col gap-1 text-sm font-bold">
            {t('templates.process')}
            <select
              className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2 font-normal"
              value={process}
              onChange={(e) => setProcess(e.target.value as Process)}
            >
              {PROCESSES.map((p) => (
                <option key={p} value={p}>
                  {t(`common:process.${p}`)}
                </option>
              ))}
            </select>
          </label>
        }
      />
      {templates.isPending ? (
        <Loading />
      ) : templates.error ? (
        <ErrorPanel message={templates.error.message} />
      ) : current ? (
        <TemplateEditor key={process} template={current.template} />
      ) : (
        <ErrorPanel message={t('templates.none')} />
      )}
    </>
  );
}
