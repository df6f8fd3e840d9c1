import { Link } from 'react-router';
import { useTranslation } from 'react-i18next';
import { ErrorPanel } from '@/components/ui/panels';
import { paths } from '@/config/paths';

export function Forbidden() {
  const { t } = useTranslation();
  return (
    <ErrorPanel
      title={t('errors.forbiddenTitle')}
      message={t('errors.forbidden')}
      action={
        <Link className="font-bold text-harbour-700 underline" to={paths.home}>
          {t('errors.home')}
        </Link>
      }
    />
  );
}
