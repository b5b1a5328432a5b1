import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { formatDistanceToNow, parseISO } from 'date-fns';
import { formatDate, formatDateTime } from '@shared/dates';
import { ArrowLeft, BookOpen, History, Map as MapIcon, SearchX, Users } from 'lucide-react';
import { formatLength } from '@shared/geometry';
import { plotKindLabels, sunLabels, type PlotDetail, type PlotKind } from '@shared/schemas/plots';
import { buttonClasses } from '@/components/ui/button';
import { DeadEnd } from '@/components/ui/dead-end';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { LocalDate, useTimeZone } from '@/lib/time-zone';
import { usePlot } from '../api/get-plot';
import { formatPlotArea, formatSize, formatSoilDepth, sideText } from '../lib/format';
import { CardSection } from '@/components/ui/page-section';

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5 border-b border-paper-200 py-2.5 last:border-b-0 sm:flex-row sm:gap-4">
      <dt className="font-medium text-stone sm:w-40 sm:shrink-0">{term}</dt>
      <dd className="min-w-0 break-words">{children}</dd>
    </div>
  );
}

const kindLabel = (kind: string) => plotKindLabels[kind as PlotKind] ?? kind;

/** A soil test date is a calendar date: it shows as that day in any zone. */
const formatDay = (isoDate: string) => formatDate(isoDate, 'UTC');

function Details({ plot }: { plot: PlotDetail }) {
  const u = plot.units;
  return (
    <dl>
      <Fact term="Kind">{kindLabel(plot.kind)}</Fact>
      <Fact term="Size">{formatSize(plot.width, plot.length, u)}</Fact>
      <Fact term="Area">{formatPlotArea(plot.area, u)}</Fact>
      <Fact term="Sun">{sunLabels[plot.sun]}</Fact>
      <Fact term="Soil depth">
        {plot.soilDepth === null ? <span className="text-stone">Not measured</span> : formatSoilDepth(plot.soilDepth, u)}
      </Fact>
      <Fact term="Soil pH">
        {plot.soilPh === null ? (
          <span className="text-stone">Not tested</span>
        ) : (
          <>
            {plot.soilPh}
            {plot.soilTestedOn && <span className="text-stone"> (tested {formatDay(plot.soilTestedOn)})</span>}
          </>
        )}
      </Fact>
      {plot.soilPh === null && plot.soilTestedOn && <Fact term="Soil tested">{formatDay(plot.soilTestedOn)}</Fact>}
      <Fact term="Accessible">{plot.isAccessible ? 'Yes' : 'No'}</Fact>
      <Fact term="Water tap">{plot.hasWaterTap ? 'Yes, at the plot' : 'No'}</Fact>
      <Fact term="Notes">{plot.notes ? <span className="whitespace-pre-line">{plot.notes}</span> : <span className="text-stone">None</span>}</Fact>
    </dl>
  );
}

function Neighbours({ plot, clubId }: { plot: PlotDetail; clubId: number }) {
  if (plot.neighbours.length === 0) {
    return <p className="text-stone">No other plot touches this one or faces it across a path.</p>;
  }
  return (
    <ul className="flex flex-col divide-y divide-paper-200">
      {plot.neighbours.map((n) => (
        <li key={n.plotId} className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 py-2.5">
          <Link to={paths.plot(clubId, n.plotId)} className="inline-flex min-h-11 min-w-11 items-center font-semibold">
            {n.label}
          </Link>
          <span>
            {sideText(n.side)},{' '}
            {n.kind === 'touching' ? 'touching' : `across a ${formatLength(n.gap, plot.units)} path`}
          </span>
        </li>
      ))}
    </ul>
  );
}

// Coordinators see who did each step (null: a person since removed); others are never sent names.
function HistoryList({ plot, showsPeople }: { plot: PlotDetail; showsPeople: boolean }) {
  const zone = useTimeZone();
  if (plot.history.length === 0) return <p className="text-stone">Nothing recorded yet.</p>;
  // Newest first, whatever order the list arrives in.
  const events = [...plot.history].sort((a, b) => b.at.localeCompare(a.at) || b.id - a.id);
  return (
    <ol className="flex flex-col gap-4">
      {events.map((event) => {
        const at = parseISO(event.at);
        return (
          <li key={event.id} className="border-l-3 border-leaf-100 pl-4">
            <p className="font-medium">{event.summary}</p>
            <p className="text-sm text-stone">
              {showsPeople && <>{event.byName ?? 'Someone no longer in the club'} · </>}
              <time dateTime={event.at} title={formatDateTime(at, zone)}>
                {formatDateTime(at, zone)} ({formatDistanceToNow(at, { addSuffix: true })})
              </time>
            </p>
          </li>
        );
      })}
    </ol>
  );
}

export interface PlotPageProps {
  clubId: number;
  /** From the URL; NaN when the URL holds no number. */
  plotId: number;
  /** Coordinators get a link to edit the plot on the map. */
  canEdit: boolean;
}

function PlotNotFound({ clubId }: { clubId: number }) {
  return (
    <DeadEnd clubId={clubId} icon={SearchX} title="We can't find that plot">
      <p>It may have been taken off the map, or the link belongs to another club.</p>
    </DeadEnd>
  );
}

function LoadedPlotPage({ clubId, plotId, canEdit }: PlotPageProps) {
  const query = usePlot(plotId);
  if (isApiError(query.error, 404)) return <PlotNotFound clubId={clubId} />;
  if (query.isPending) return <LoadingState label="Loading the plot…" />;
  if (query.isError) {
    return (
      <ErrorState
        message={query.error.message}
        requestId={isApiError(query.error) ? query.error.requestId : undefined}
        onRetry={() => void query.refetch()}
        retrying={query.isFetching}
      />
    );
  }

  const plot = query.data;
  return (
    <>
      <title>{`Plot ${plot.label} · ${plot.siteName} · Tillwell`}</title>
      <Link to={paths.sitePlots(clubId, plot.siteId)} className="mb-4 inline-flex min-h-11 items-center gap-1.5 font-medium">
        <ArrowLeft className="size-5" aria-hidden="true" />
        All plots on {plot.siteName}
      </Link>
      <PageHeader
        eyebrow={plot.siteName}
        title={`Plot ${plot.label}`}
        description={`${kindLabel(plot.kind)}, ${formatSize(plot.width, plot.length, plot.units)} (${formatPlotArea(plot.area, plot.units)})`}
        actions={
          <div className="flex flex-wrap gap-2">
            {(canEdit || plot.holder) && (
              <Link to={paths.plotBook(clubId, plot.id)} className={buttonClasses('primary')}>
                <BookOpen className="size-5" aria-hidden="true" />
                Plot book
              </Link>
            )}
            {canEdit && (
              <Link to={`${paths.map(clubId)}?site=${plot.siteId}&plot=${plot.id}`} className={buttonClasses('secondary')}>
                <MapIcon className="size-5" aria-hidden="true" />
                Edit on the map
              </Link>
            )}
          </div>
        }
      />
      <div className="grid gap-6 lg:grid-cols-2">
        <CardSection id="plot-details" title="About this plot">
          <Details plot={plot} />
        </CardSection>
        <div className="flex min-w-0 flex-col gap-6">
          <CardSection id="plot-holder" title={plot.season ? `The ${plot.season.year} season` : 'This season'}>
            <SeasonState plot={plot} />
          </CardSection>
          <CardSection id="plot-neighbours" title="Neighbours">
            <Neighbours plot={plot} clubId={clubId} />
          </CardSection>
        </div>
        <div className="lg:col-span-2">
          <CardSection id="plot-history" title="History">
            <div className="mb-3 flex items-center gap-2 text-sm text-stone">
              <History className="size-4" aria-hidden="true" />
              Newest first
            </div>
            <HistoryList plot={plot} showsPeople={canEdit} />
          </CardSection>
        </div>
      </div>
    </>
  );
}

/** Where the plot stands in the club's newest season, in a sentence, with only what this viewer may see. */
function SeasonState({ plot }: { plot: PlotDetail }) {
  if (!plot.season) return <p className="text-stone">No season has been opened yet.</p>;
  const { year, state } = plot.season;
  const line = (children: ReactNode) => (
    <p className="flex items-center gap-2">
      <Users className="size-5 shrink-0 text-leaf" aria-hidden="true" />
      <span>{children}</span>
    </p>
  );
  switch (state.status) {
    case 'taken':
      return line(state.holder ? <>Held by <strong className="font-semibold">{state.holder.name}</strong> for {year}</> : <>Taken for {year}</>);
    case 'offered':
      return line(
        state.offer ? (
          <>Offered to <strong className="font-semibold">{state.offer.name}</strong>, who can answer until <LocalDate value={state.offer.deadline} withTime /></>
        ) : (
          <>Taken for {year}</>
        ),
      );
    case 'renewal_pending':
      return line(
        state.renewal ? (
          <>Waiting for <strong className="font-semibold">{state.renewal.name}</strong> to renew for {year}, until <LocalDate value={state.renewal.deadline} withTime /></>
        ) : (
          <>Taken for {year}</>
        ),
      );
    case 'free':
      return <p className="text-stone">Free for {year}</p>;
  }
}

/** One plot for any club member: its details in the site's units, who holds it, its neighbours and history. */
export function PlotPage({ clubId, plotId, canEdit }: PlotPageProps) {
  if (!Number.isInteger(plotId) || plotId <= 0) return <PlotNotFound clubId={clubId} />;
  return <LoadedPlotPage clubId={clubId} plotId={plotId} canEdit={canEdit} />;
}
