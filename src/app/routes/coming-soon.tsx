import { Sprout } from 'lucide-react';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { useClubContext } from '../app-context';

/** A placeholder for pages that are planned but not built; it says so plainly. */
export function ComingSoonRoute({ title, description }: { title: string; description: string }) {
  const { club } = useClubContext();
  return (
    <>
      <title>{`${title} · ${club.clubName} · Tillwell`}</title>
      <PageHeader eyebrow={club.clubName} title={title} description={description} />
      <Card>
        <EmptyState icon={Sprout} title="Coming soon">
          <p>This part of Tillwell is still growing. Nothing on this page works yet; when it does, it will appear right here.</p>
        </EmptyState>
      </Card>
    </>
  );
}
