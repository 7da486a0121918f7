import { Link } from 'react-router';
import { paths } from '@/config/paths';
import { EmptyState } from '@/components/page';

export function Component() {
  return (
    <EmptyState
      message="There is no page at this address."
      action={
        <Link className="text-copper-700 underline" to={paths.home()}>
          Go to the home page
        </Link>
      }
    />
  );
}
