import { Link } from 'react-router';
import { useTranslation } from 'react-i18next';
import { ErrorPanel } from '@/components/ui/panels';
import { paths } from '@/config/paths';

export function Component() {
  const { t } = useTranslation();
  return (
    <div className="mx-auto max-w-2xl">
      <ErrorPanel
        title={t('errors.notFoundTitle')}
        message={t('errors.notFound')}
        action={
          <Link className="font-bold text-harbour-700 underline" to={paths.home}>
            {t('errors.home')}
          </Link>
        }
      />
    </div>
  );
}
