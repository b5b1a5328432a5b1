import { useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Download } from 'lucide-react';
import { feeStatusFilters, type FeesQuery } from '@shared/schemas/fees';
import { buttonClasses } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { feesCsvUrl } from '../api/fees-csv';
import { useFees } from '../api/get-fees';
import { CoordinatorsOnly } from '@/components/coordinators-only';
import { FeeTotals } from './fee-totals';
import { FeesTable } from './fees-table';
import { PaymentPanel } from './payment-panel';

const statusLabels: Record<FeesQuery['status'], string> = { all: 'All fees', unpaid: 'Still owed', paid: 'Paid in full' };

function readYear(value: string | null): number | undefined {
  return value && /^\d{4}$/.test(value) ? Number(value) : undefined;
}

function readStatus(value: string | null): FeesQuery['status'] {
  return feeStatusFilters.find((s) => s === value) ?? 'all';
}

export interface FeesPageProps {
  clubId: number;
  clubName: string;
  /** The club currency, for totals when no fee is listed yet. */
  currency: string;
}

/** Coordinators' fees page: totals, every fee with its balance, recording payments, and the CSV export. */
export function FeesPage({ clubId, clubName, currency }: FeesPageProps) {
  const [params, setParams] = useSearchParams();
  const year = readYear(params.get('year'));
  const status = readStatus(params.get('status'));
  const fees = useFees({ clubId, year, status });
  // Every season's fees give the seasons to choose from; with no filters this is the same request.
  const allFees = useFees({ clubId, status: 'all' });
  const [selectedId, setSelectedId] = useState<number | null>(null);

  const years = useMemo(
    () => [...new Set((allFees.data?.items ?? []).map((f) => f.seasonYear))].sort((a, b) => b - a),
    [allFees.data],
  );
  const selected = fees.data?.items.find((f) => f.id === selectedId) ?? allFees.data?.items.find((f) => f.id === selectedId) ?? null;

  const setFilter = (key: 'year' | 'status', value: string) => {
    const next = new URLSearchParams(params);
    if (value && value !== 'all') next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
  };

  if (isApiError(fees.error, 403)) return <CoordinatorsOnly clubId={clubId} page="fees" />;

  const shownCurrency = fees.data?.items[0]?.currency ?? currency;

  return (
    <>
      <title>{`Fees · ${clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow={clubName}
        title="Fees"
        description="What each plot holder owes for the season, what has come in, and deposits held. Fees still owed come first."
        actions={
          <a href={feesCsvUrl(clubId, year)} download className={buttonClasses('secondary')}>
            <Download className="size-5" aria-hidden="true" />
            Download CSV
          </a>
        }
      />
      <div className="flex flex-col gap-6">
        <div className="flex flex-col gap-4 sm:flex-row">
          <Select label="Season" value={year ? String(year) : ''} onChange={(e) => setFilter('year', e.target.value)} className="sm:w-48">
            <option value="">Every season</option>
            {years.map((y) => (
              <option key={y} value={y}>
                {y}
              </option>
            ))}
          </Select>
          <Select label="Show" value={status} onChange={(e) => setFilter('status', e.target.value)} className="sm:w-48">
            {feeStatusFilters.map((s) => (
              <option key={s} value={s}>
                {statusLabels[s]}
              </option>
            ))}
          </Select>
        </div>

        {fees.isPending ? (
          <LoadingState label="Loading fees…" />
        ) : fees.isError ? (
          <ErrorState
            message={fees.error.message}
            requestId={isApiError(fees.error) ? fees.error.requestId : undefined}
            onRetry={() => void fees.refetch()}
            retrying={fees.isFetching}
          />
        ) : (
          <>
            <section aria-label="Totals">
              <FeeTotals totals={fees.data.totals} currency={shownCurrency} />
            </section>
            {selected && <PaymentPanel key={selected.id} fee={selected} onClose={() => setSelectedId(null)} />}
            <section aria-labelledby="fee-list" className="min-w-0">
              <h2 id="fee-list" className="mb-4 text-xl font-semibold">
                {year ? `${year} season` : 'Every season'} · {statusLabels[status].toLowerCase()}
              </h2>
              <FeesTable fees={fees.data.items} onRecord={setSelectedId} />
            </section>
          </>
        )}
      </div>
    </>
  );
}
