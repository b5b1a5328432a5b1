import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import type { ColumnDef } from '@tanstack/react-table';
import { Sprout } from 'lucide-react';
import { cropKinds, type CropSummary } from '@shared/schemas/crops';
import type { CropKind } from '@shared/crops/types';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { DataTable } from '@/components/ui/data-table';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useCrops } from '../api/get-crops';
import { formatMaturity, kindLabels, sowingLabels } from '../lib/format';
import { AddClubCrop } from './add-club-crop';

function columnsFor(clubId: number): ColumnDef<CropSummary>[] {
  return [
    {
      id: 'name',
      header: 'Crop',
      accessorFn: (crop) => crop.commonName,
      cell: ({ row }) => (
        <span className="flex flex-wrap items-center gap-2">
          <Link to={paths.crop(clubId, row.original.id)} className="inline-flex min-h-11 min-w-11 items-center font-semibold">
            {row.original.commonName}
          </Link>
          {row.original.isClubCrop && <Badge tone="straw">Club crop</Badge>}
          {row.original.hasOverrides && <Badge tone="leaf">Club values</Badge>}
        </span>
      ),
    },
    {
      id: 'botanicalName',
      header: 'Botanical name',
      accessorFn: (crop) => crop.botanicalName,
      cell: ({ getValue }) => <i>{getValue<string>()}</i>,
    },
    { id: 'family', header: 'Family', accessorFn: (crop) => crop.family },
    { id: 'kind', header: 'Kind', accessorFn: (crop) => kindLabels[crop.kind] },
    {
      id: 'sowing',
      header: 'Sown',
      accessorFn: (crop) => sowingLabels[crop.sowing],
    },
    {
      id: 'daysToMaturity',
      header: 'Days to maturity',
      // Sorted by the short end, then the long end, as the server sorts.
      accessorFn: (crop) => crop.daysToMaturity.min * 10_000 + crop.daysToMaturity.max,
      enableGlobalFilter: false,
      cell: ({ row }) => <span className="tabular-nums">{formatMaturity(row.original.daysToMaturity)}</span>,
    },
  ];
}

export interface CropsPageProps {
  clubId: number;
  clubName: string;
  /** Coordinators see "Add a club crop"; the server still decides. */
  canAddCrops?: boolean;
}

/** The crop notes table: every crop the club sees, searched by name and narrowed by family and kind. */
export function CropsPage({ clubId, clubName, canAddCrops = false }: CropsPageProps) {
  const crops = useCrops(clubId);
  const [family, setFamily] = useState('');
  const [kind, setKind] = useState<CropKind | ''>('');
  const columns = useMemo(() => columnsFor(clubId), [clubId]);
  const items = crops.data?.items;
  const families = useMemo(() => [...new Set((items ?? []).map((c) => c.family))].sort(), [items]);
  const kinds = useMemo(() => cropKinds.filter((k) => (items ?? []).some((c) => c.kind === k)), [items]);
  const shown = useMemo(
    () => (items ?? []).filter((c) => (!family || c.family === family) && (!kind || c.kind === kind)),
    [items, family, kind],
  );

  let body;
  if (crops.isPending) body = <LoadingState label="Loading the crop notes…" />;
  else if (crops.isError) {
    body = (
      <ErrorState
        message={crops.error.message}
        requestId={isApiError(crops.error) ? crops.error.requestId : undefined}
        onRetry={() => void crops.refetch()}
        retrying={crops.isFetching}
      />
    );
  } else if (crops.data.items.length === 0) {
    body = (
      <Card>
        <EmptyState icon={Sprout} title="No crop notes yet">
          <p>The reference crops load when the server starts. If this stays empty, ask your coordinator to check the server.</p>
        </EmptyState>
      </Card>
    );
  } else {
    body = (
      <div className="flex flex-col gap-4">
        <div className="grid gap-4 sm:max-w-xl sm:grid-cols-2">
          <Select label="Family" value={family} onChange={(e) => setFamily(e.target.value)}>
            <option value="">Every family</option>
            {families.map((f) => (
              <option key={f} value={f}>
                {f}
              </option>
            ))}
          </Select>
          <Select label="Kind" value={kind} onChange={(e) => setKind(e.target.value as CropKind | '')}>
            <option value="">Every kind</option>
            {kinds.map((k) => (
              <option key={k} value={k}>
                {kindLabels[k]}
              </option>
            ))}
          </Select>
        </div>
        <DataTable
          data={shown}
          columns={columns}
          caption="Crop notes"
          filterLabel="Search by name"
          emptyMessage="No crop is in that family and of that kind."
          initialSorting={[{ id: 'name', desc: false }]}
          pageSizes={[50, 100]}
          getRowId={(crop) => String(crop.id)}
        />
      </div>
    );
  }

  return (
    <>
      <title>{`Crop notes · ${clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow={clubName}
        title="Crop notes"
        description="How each crop is sown, spaced, watered and stored, with the source of every value. Open a crop for its details, good pairings and what to watch for."
        actions={canAddCrops ? <AddClubCrop clubId={clubId} /> : undefined}
      />
      {body}
    </>
  );
}
