import { useState } from 'react';
import { ADMIN_ONLY } from '@shared/domain/access';
import { PROCESSES, type Process } from '@shared/domain/vocabulary';
import { queryClient } from '@/lib/query-client';
import { templatesQueryOptions, useTemplates } from '@/features/orders/api/routing';
import { TemplateEditor } from '@/features/orders/components/template-editor';
import { ErrorPanel, Loading, PageHeader } from '@/components/ui/panels';
import { humanise } from '@/lib/labels';

export const handle = { roles: ADMIN_ONLY };
export const loader = () => queryClient.ensureQueryData(templatesQueryOptions());

export function Component() {
  const templates = useTemplates();
  const [process, setProcess] = useState<Process>('hard_enamel');
  const current = templates.data?.find((t) => t.process === process);
  return (
    <>
      <PageHeader
        title="Routing templates"
        subtitle="How an order's steps are made from its spec, per process. Standard minutes here are starting values for this factory to adjust."
        actions={
          <label className="flex flex-col gap-1 text-sm font-bold">
            Process
            <select className="min-h-11 rounded-lg border-2 border-harbour-100 bg-white px-2 font-normal" value={process} onChange={(e) => setProcess(e.target.value as Process)}>
              {PROCESSES.map((p) => (
                <option key={p} value={p}>
                  {humanise(p)}
                </option>
              ))}
            </select>
          </label>
        }
      />
      {templates.isPending ? <Loading /> : templates.error ? <ErrorPanel message={templates.error.message} /> : current ? <TemplateEditor key={process} template={current.template} /> : <ErrorPanel message="No template for this process." />}
    </>
  );
}
