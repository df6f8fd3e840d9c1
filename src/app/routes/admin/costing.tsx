import { useTranslation } from 'react-i18next';
import { ADMIN_ONLY } from '@shared/domain/access';
import { queryClient } from '@/lib/query-client';
import { errorText } from '@/lib/error-text';
import { costingSettingsQueryOptions, useCostingSettings, useSaveCostingSettings } from '@/features/costing/api/settings';
import { CostingSettingsForm } from '@/features/costing/components/costing-settings-form';
import { Card, ErrorPanel, Loading, PageHeader } from '@/components/ui/panels';

export const handle = { roles: ADMIN_ONLY };
export const loader = () => queryClient.ensureQueryData(costingSettingsQueryOptions());

export function Component() {
  const { t } = useTranslation('costing');
  const settings = useCostingSettings();
  const save = useSaveCostingSettings();
  return (
    <>
      <PageHeader title={t('settings.title')} subtitle={t('settings.subtitle')} />
      {settings.isPending ? (
        <Loading />
      ) : settings.error ? (
        <ErrorPanel message={errorText(settings.error)} />
      ) : (
        <Card>
          <CostingSettingsForm
            key={JSON.stringify(settings.data)}
            initial={settings.data}
            pending={save.isPending}
            error={save.error && errorText(save.error)}
            saved={save.isSuccess}
            onSubmit={(s) => save.mutate(s)}
          />
        </Card>
      )}
    </>
  );
}
