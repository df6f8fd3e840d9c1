import { Link } from 'react-router';
import { ErrorPanel } from '@/components/ui/panels';
import { paths } from '@/config/paths';

export function Forbidden() {
  return (
    <ErrorPanel
      title="Not part of your role"
      message="This screen belongs to another role. Your own start page has what you need; ask an administrator if your role should change."
      action={
        <Link className="font-bold text-harbour-700 underline" to={paths.home}>
          Go to my start page
        </Link>
      }
    />
  );
}
