import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Archive, Trash2 } from 'lucide-react';
import type { Site } from '@shared/schemas/sites';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { paths } from '@/lib/paths';
import { useRemoveSite } from '../api/remove-site';

/**
 * Archiving a site (it leaves the lists and the map; its records stay for fees), or deleting one
 * that has never had allocations, fees or payments. Each asks once more before it acts.
 */
export function SiteRemove({ clubId, site }: { clubId: number; site: Site }) {
  const remove = useRemoveSite(site);
  const navigate = useNavigate();
  const [confirming, setConfirming] = useState<'archive' | 'delete' | null>(null);
  const [alert, setAlert] = useState<string | null>(null);

  const act = async (how: 'archive' | 'delete') => {
    setAlert(null);
    try {
      await remove.mutateAsync(how);
      void navigate(paths.sites(clubId));
    } catch (err) {
      setConfirming(null);
      setAlert(err instanceof Error ? err.message : 'That did not work. Try again.');
    }
  };

  return (
    <div className="space-y-3">
      <p className="text-stone">
        Archive a site the club no longer gardens: it leaves the site list and the map, and its plots’ holders, fees and payments stay on
        record. A site with no such records can be deleted for good instead.
      </p>
      {confirming ? (
        <div className="flex flex-wrap gap-2">
          <Button type="button" variant="danger" loading={remove.isPending} loadingText="Working…" onClick={() => void act(confirming)}>
            {confirming === 'archive' ? `Yes, archive ${site.name}` : `Yes, delete ${site.name} for good`}
          </Button>
          <Button type="button" variant="ghost" onClick={() => setConfirming(null)}>
            Keep it
          </Button>
        </div>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button type="button" variant="secondary" onClick={() => setConfirming('archive')}>
            <Archive className="size-5" aria-hidden="true" /> Archive site
          </Button>
          <Button type="button" variant="ghost" onClick={() => setConfirming('delete')}>
            <Trash2 className="size-5" aria-hidden="true" /> Delete site
          </Button>
        </div>
      )}
      {alert && <Alert tone="error">{alert}</Alert>}
    </div>
  );
}
