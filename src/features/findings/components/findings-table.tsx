import { useMemo } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import type { ColumnDef } from '@tanstack/react-table';
import { Download, ScanSearch } from 'lucide-react';
import { findingKinds, findingSeverities, type FindingList } from '@shared/schemas/findings';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DataTable } from '@/components/ui/data-table';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { PageSection } from '@/components/ui/page-section';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import type { ClubFindingFilters } from '../api/club-findings-keys';
import { clubFindingsCsvUrl, useClubFindings } from '../api/get-club-findings';
import {
  cautionFor,
  countBySeverity,
  countsSentence,
  evidenceLabel,
  kindLabels,
  severityLabels,
  severityOrder,
  type Kind,
  type Severity,
} from '../lib/finding-words';
import { SeverityTag } from './severity-symbol';

type Row = FindingList['items'][number];

export interface FindingsPageProps {
  clubId: number;
  clubName: string;
  /** The club's seasons, newest first. */
  seasons: Array<{ id: number; year: number }>;
  sites: Array<{ id: number; name: string }>;
}

function columnsFor(clubId: number): ColumnDef<Row>[] {
  return [
    { id: 'site', header: 'Site', accessorFn: (f) => f.siteName },
    {
      id: 'plot',
      header: 'Plot',
      accessorFn: (f) => f.plotLabel,
      cell: ({ row }) => (
        <Link to={paths.plot(clubId, row.original.plotId)} className="inline-flex min-h-11 min-w-11 items-center font-semibold">
          {row.original.plotLabel}
        </Link>
      ),
    },
    { id: 'crop', header: 'Crop', accessorFn: (f) => f.cropName },
    {
      id: 'severity',
      header: 'Severity',
      // Sorted worst first, not by the word.
      accessorFn: (f) => severityOrder.indexOf(f.severity),
      enableGlobalFilter: false,
      cell: ({ row }) => <SeverityTag severity={row.original.severity} />,
    },
    { id: 'kind', header: 'Kind', accessorFn: (f) => kindLabels[f.kind] },
    {
      id: 'title',
      header: 'Finding',
      accessorFn: (f) => `${f.title} ${f.message}`,
      sortingFn: (a, b) => a.original.title.localeCompare(b.original.title),
      cell: ({ row }) => {
        const caution = cautionFor(row.original.title, row.original.message);
        return (
          <span className="block break-words sm:min-w-80">
            <span className="block font-medium">{row.original.title}</span>
            <span className="mt-0.5 block">{row.original.message}</span>
            {row.original.peers.length > 0 && (
              <span className="mt-1 block text-sm text-stone">
                With {row.original.peers.map((p) => `${p.cropName} on ${p.plotLabel} (${p.seasonYear})`).join('; ')}.
              </span>
            )}
            {caution && <span className="mt-1 block text-sm text-clay-700">{caution}</span>}
          </span>
        );
      },
    },
    {
      id: 'source',
      header: 'Source',
      accessorFn: (f) => `${f.source.title} ${evidenceLabel(f.source.evidence)}`,
      cell: ({ row }) => {
        const { source } = row.original;
        return (
          <span className="block break-words text-sm sm:min-w-48">
            {source.url ? (
              <a href={source.url} target="_blank" rel="noreferrer">
                {source.title}
              </a>
            ) : (
              source.title
            )}
            <span className="block text-sm text-stone">{evidenceLabel(source.evidence)}</span>
          </span>
        );
      },
    },
    {
      id: 'kept',
      header: 'Kept because',
      accessorFn: (f) => f.keptReason ?? '',
      cell: ({ row }) => <span className="block break-words sm:min-w-40">{row.original.keptReason ?? '—'}</span>,
    },
  ];
}

function pickOf<T extends string>(value: string | null, allowed: readonly T[]): T | undefined {
  return allowed.find((a) => a === value);
}

function idOf(value: string | null, allowed: Array<{ id: number }>): number | undefined {
  const n = Number(value);
  return allowed.some((a) => a.id === n) ? n : undefined;
}

/**
 * `/clubs/:clubId/findings`: every finding of a season's plantings across the club, for
 * coordinators. The selects set the page's query, which goes to the server as the filters; the
 * table sorts what came back; the CSV link carries the same filters.
 */
export function FindingsPage({ clubId, clubName, seasons, sites }: FindingsPageProps) {
  const [params, setParams] = useSearchParams();
  const seasonId = idOf(params.get('season'), seasons) ?? seasons[0]?.id;
  const filters: ClubFindingFilters = {
    clubId,
    seasonId,
    siteId: idOf(params.get('site'), sites),
    severity: pickOf(params.get('severity'), findingSeverities),
    kind: pickOf(params.get('kind'), findingKinds),
  };
  const findings = useClubFindings(filters);
  const columns = useMemo(() => columnsFor(clubId), [clubId]);
  const year = findings.data?.seasonYear ?? seasons.find((s) => s.id === seasonId)?.year;

  const setParam = (name: string, value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(name, value);
    else next.delete(name);
    setParams(next, { replace: true });
  };

  const header = (
    <>
      <title>{`Neighbour check · ${clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow={clubName}
        title="Neighbour check"
        description="Each planting of a season checked against its bed's past seasons, its neighbours, their shade and the place: clashes to act on, things to watch and good pairings, each with where its rule comes from and any reason a holder gave for keeping a planting."
      />
    </>
  );

  if (seasons.length === 0) {
    return (
      <>
        {header}
        <Card>
          <EmptyState icon={ScanSearch} title="No season yet">
            <p>The neighbour check reads a season&apos;s plantings. Open the first season in the spring round; findings appear as holders plan their plots.</p>
          </EmptyState>
        </Card>
      </>
    );
  }

  let body;
  if (findings.isPending) body = <LoadingState label="Loading the neighbour check…" />;
  else if (findings.isError) {
    body = (
      <ErrorState
        title="The neighbour check could not be loaded"
        message={findings.error.message}
        requestId={isApiError(findings.error) ? findings.error.requestId : undefined}
        onRetry={() => void findings.refetch()}
        retrying={findings.isFetching}
      />
    );
  } else {
    const items = findings.data.items;
    const filtered = Boolean(filters.siteId || filters.severity || filters.kind);
    body = (
      <PageSection id="findings-table" title={`Findings${year ? `, ${year}` : ''}`}>
        <p className="mb-3 text-stone" role="status">
          {items.length === 1 ? '1 finding' : `${items.length} findings`}
          {items.length > 0 ? `: ${countsSentence(countBySeverity(items))}` : ''}
          {filtered ? ' (filtered)' : ''}.
        </p>
        <DataTable
          data={items}
          columns={columns}
          caption={`Neighbour check findings${year ? `, ${year}` : ''}`}
          filterLabel="Search the findings"
          emptyMessage={filtered ? 'No findings match these filters.' : 'Nothing was found in this season’s plantings.'}
          initialSorting={[{ id: 'severity', desc: false }]}
          pageSizes={[25, 50, 100]}
          getRowId={(f) => `${f.key}-${f.plantingId}`}
        />
      </PageSection>
    );
  }

  return (
    <>
      {header}
      <div className="flex flex-col gap-6">
        <form
          className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-[repeat(4,minmax(0,12rem))_auto] lg:items-end"
          aria-label="Filters"
          onSubmit={(e) => e.preventDefault()}
        >
          <Select label="Season" value={String(seasonId ?? '')} onChange={(e) => setParam('season', e.target.value)}>
            {seasons.map((s) => (
              <option key={s.id} value={s.id}>
                {s.year}
              </option>
            ))}
          </Select>
          <Select label="Site" value={String(filters.siteId ?? '')} onChange={(e) => setParam('site', e.target.value)}>
            <option value="">Every site</option>
            {sites.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </Select>
          <Select label="Severity" value={filters.severity ?? ''} onChange={(e) => setParam('severity', e.target.value)}>
            <option value="">Every severity</option>
            {findingSeverities.map((s: Severity) => (
              <option key={s} value={s}>
                {severityLabels[s]}
              </option>
            ))}
          </Select>
          <Select label="Kind" value={filters.kind ?? ''} onChange={(e) => setParam('kind', e.target.value)}>
            <option value="">Every kind</option>
            {findingKinds.map((k: Kind) => (
              <option key={k} value={k}>
                {kindLabels[k]}
              </option>
            ))}
          </Select>
          <a href={clubFindingsCsvUrl(filters)} download className={buttonClasses('secondary', 'w-full sm:w-auto')}>
            <Download className="size-5" aria-hidden="true" /> Download CSV
          </a>
        </form>
        {body}
      </div>
    </>
  );
}
