import { isRouteErrorResponse, Link, useRouteError } from 'react-router';
import { useTranslation } from 'react-i18next';
import { ErrorPanel } from '@/components/ui/panels';
import { ApiError } from '@/lib/api-client';
import { errorText } from '@/lib/error-text';
import { paths } from '@/config/paths';

/** The error boundary of every route: a readable message, never a stack trace. */
export function RouteError() {
  const { t } = useTranslation();
  const error = useRouteError();
  let title = t('errors.pageTitle');
  let message = t('errors.page');
  if (isRouteErrorResponse(error)) {
    if (error.status === 404) {
      title = t('errors.notFoundTitle');
      message = t('errors.notFound');
    } else message = t('errors.status', { status: error.status });
  } else if (error instanceof ApiError) {
    if (error.status === 404) title = t('errors.notFoundTitle');
    message = errorText(error);
  }
  return (
    <div className="mx-auto max-w-2xl p-6">
      <ErrorPanel
        title={title}
        message={message}
        action={
          <Link className="font-bold text-harbour-700 underline" to={paths.home}>
            {t('errors.home')}
          </Link>
        }
      />
    </div>
  );
}
