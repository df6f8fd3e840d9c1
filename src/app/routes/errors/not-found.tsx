import { Link } from 'react-router';
import { ErrorPanel } from '@/components/ui/panels';
import { paths } from '@/config/paths';

export function Component() {
  return (
    <div className="mx-auto max-w-2xl">
      <ErrorPanel
        title="Not found"
        message="There is no page at this address. Check the link, or go back to your start page."
        action={
          <Link className="font-bold text-harbour-700 underline" to={paths.home}>
            Go to my start page
          </Link>
        }
      />
    </div>
  );
}
