import { isRouteErrorResponse, Link, useRouteError } from 'react-router';
import { ErrorPanel } from '@/components/ui/panels';
import { ApiError } from '@/lib/api-client';
import { paths } from '@/config/paths';

/** The error boundary of every route: a readable message, never a stack trace. */
export function RouteError() {
  const error = useRouteError();
  let title = 'This page could not be shown';
  let message = 'Something unexpected happened. Reload the page; if it happens again, tell your administrator what you were doing.';
  if (isRouteErrorResponse(error)) {
    if (error.status === 404) {
      title = 'Not found';
      message = 'There is nothing at this address. Check the link, or go back to your start page.';
    } else message = `The page answered ${error.status}.`;
  } else if (error instanceof ApiError) {
    if (error.status === 404) title = 'Not found';
    message = error.message;
  }
  return (
    <div className="mx-auto max-w-2xl p-6">
      <ErrorPanel
        title={title}
        message={message}
        action={
          <Link className="font-bold text-harbour-700 underline" to={paths.home}>
            Go to my start page
          </Link>
        }
      />
    </div>
  );
}
