import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { ADMIN_ONLY } from '@shared/domain/access';
import { LOCALES, type Locale } from '@shared/domain/vocabulary';
import { queryClient } from '@/lib/query-client';
import { factoryLanguageQueryOptions, useFactoryLanguage, useSaveFactoryLanguage } from '@/features/admin/api/factory-language';
import { Card, ErrorPanel, Loading, PageHeader } from '@/components/ui/panels';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { errorText } from '@/lib/error-text';

export const handle = { roles: ADMIN_ONLY };
export const loader = () => queryClient.ensureQueryData(factoryLanguageQueryOptions());

// each language named in itself, as the switchers do
const LANGUAGE_NAMES: Record<Locale, string> = { en: 'English', 'zh-CN': '简体中文' };

function PrintLanguage({ current }: { current: Locale }) {
  const { t } = useTranslation('admin');
  const save = useSaveFactoryLanguage();
  const [language, setLanguage] = useState<Locale>(current);
  return (
    <form
      className="flex flex-wrap items-end gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        save.mutate({ language });
      }}
    >
      <SelectField
        label={t('settings.printLanguage')}
        hint={t('settings.printHint')}
        value={language}
        onChange={(e) => {
          setLanguage(e.target.value as Locale);
          save.reset();
        }}
      >
        {LOCALES.map((l) => (
          <option key={l} value={l} lang={l}>
            {LANGUAGE_NAMES[l]}
          </option>
        ))}
      </SelectField>
      <Button type="submit" disabled={save.isPending || language === current}>
        {t('settings.save')}
      </Button>
      {save.isSuccess && (
        <p role="status" className="font-bold text-ok-700">
          {t('settings.saved')}
        </p>
      )}
      {save.error && <ErrorPanel title={t('settings.notSaved')} message={errorText(save.error)} />}
    </form>
  );
}

export function Component() {
  const { t } = useTranslation('admin');
  const factory = useFactoryLanguage();
  return (
    <>
      <PageHeader title={t('settings.title')} subtitle={t('settings.subtitle')} />
      <Card>
        <h2 className="mb-4 text-xl font-bold text-harbour-900">{t('settings.printTitle')}</h2>
        {factory.isPending ? (
          <Loading />
        ) : factory.error ? (
          <ErrorPanel message={errorText(factory.error)} />
        ) : (
          <PrintLanguage current={factory.data.language} />
        )}
      </Card>
    </>
  );
}
