import { useParams } from 'react-router-dom';
import { ApplyPage } from '@/features/waitlist/components/apply-page';

/** `/apply/:clubSlug`: the public waiting list form, in the signed-out layout. */
export function ApplyRoute() {
  const { clubSlug = '' } = useParams();
  return <ApplyPage key={clubSlug} slug={clubSlug} />;
}
