import { Link } from 'react-router-dom';
import { Signpost } from 'lucide-react';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { paths } from '@/lib/paths';

/** The 404 page. */
export function NotFoundRoute() {
  return (
    <AuthLayout>
      <title>Page not found · Tillwell</title>
      <EmptyState
        icon={Signpost}
        title="We can't find that page"
        headingLevel="h1"
        action={
          <Link to={paths.home()} className={buttonClasses('primary')}>
            Back to Tillwell
          </Link>
        }
      >
        <p>The address may be mistyped, or the page has moved. Check the link, or start again from home.</p>
      </EmptyState>
    </AuthLayout>
  );
}
