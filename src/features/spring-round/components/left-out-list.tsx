import { useState } from 'react';
import type { Season } from '@shared/schemas/seasons';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { isApiError } from '@/lib/api/client';
import { useCreateLateRenewal } from '../api/create-late-renewal';
import { useLeftOut } from '../api/get-left-out';

/** Last season's holders who got no renewal, why, and a way to renew those who have paid since. */
export function LeftOutList({ season }: { season: Season }) {
  const leftOut = useLeftOut(season.id);
  const renew = useCreateLateRenewal(season.id);
  const [notice, setNotice] = useState<{ tone: 'success' | 'error'; text: string } | null>(null);
  if (leftOut.isPending || leftOut.isError || leftOut.data.items.length === 0) return null;
  return (
    <section aria-labelledby="left-out" className="space-y-3">
      <h2 id="left-out" className="text-xl font-semibold">
        Left out of the {season.year} renewals
      </h2>
      <p className="text-stone">These holders of last season got no renewal e-mail. Their plots are free unless someone else has them now.</p>
      {notice && <Alert tone={notice.tone}>{notice.text}</Alert>}
      <ul className="divide-y divide-paper-200 rounded-xl border border-paper-300 bg-white">
        {leftOut.data.items.map((h) => (
          <li key={h.allocationId} className="flex flex-wrap items-center justify-between gap-3 p-3">
            <div className="min-w-0">
              <p className="font-medium">
                {h.name} · plot {h.plotLabel}, {h.siteName}
              </p>
              <p className="text-sm text-stone">{h.reason}</p>
            </div>
            {h.canRenew && (
              <Button
                variant="secondary"
                loading={renew.isPending && renew.variables === h.allocationId}
                loadingText="Sending…"
                onClick={() =>
                  renew
                    .mutateAsync(h.allocationId)
                    .then(() => setNotice({ tone: 'success', text: `Renewal for plot ${h.plotLabel} sent to ${h.name}.` }))
                    .catch((err) => setNotice({ tone: 'error', text: isApiError(err) ? err.message : 'The renewal could not be sent.' }))
                }
              >
                Send {h.name} a renewal
              </Button>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
