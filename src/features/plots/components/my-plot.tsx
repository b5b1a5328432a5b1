import { BookOpen, CalendarClock, CloudRain, Shovel } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { plotKindLabels } from '@shared/schemas/labels';
import type { MyPlotHolding } from '@shared/schemas/my-plot';
import { Alert } from '@/components/ui/alert';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { LoadingState } from '@/components/ui/spinner';
import { paths } from '@/lib/paths';
import { LocalDate } from '@/lib/time-zone';
import { useMyPlot } from '../api/get-my-plot';
import { useSitePlots } from '../api/get-site-plots';
import { PlotViewer } from './map/plot-viewer';

function HoldingMap({ holding }: { holding: MyPlotHolding }) {
  const plots = useSitePlots(holding.site.id);
  if (plots.isPending) {
    return (
      <LoadingState inline label="Loading the map…" />
    );
  }
  if (plots.isError) return <Alert tone="error">The map didn't load. {plots.error.message}</Alert>;
  return <PlotViewer site={holding.site} plots={plots.data.items} yourPlotId={holding.plotId} />;
}

export interface MyPlotProps {
  clubId: number;
  /** A line about the plot's week (src/app hands it in from the tasks feature); it draws nothing until it has something to say. */
  thisWeek?: (plotId: number) => ReactNode;
}

/** A plot holder's own plot on the club home: label, site, size and season, a renewal to answer, and a map. */
export function MyPlot({ clubId, thisWeek }: MyPlotProps) {
  const mine = useMyPlot(clubId);
  return (
    <section aria-labelledby="my-plot" className="mb-10 space-y-4">
      <h2 id="my-plot" className="text-xl font-semibold">
        My plot
      </h2>
      {mine.isPending ? (
        <LoadingState inline label="Loading your plot…" />
      ) : mine.isError ? (
        <Alert tone="error">Your plot didn't load. {mine.error.message}</Alert>
      ) : (
        <>
          {mine.data.renewal && (
            <div className="flex flex-col gap-3 rounded-xl border-l-4 border-water bg-water-50 p-5 sm:flex-row sm:items-center sm:justify-between">
              <div className="flex gap-3">
                <CalendarClock className="mt-0.5 size-6 shrink-0 text-water-700" aria-hidden="true" />
                <div>
                  <h3 className="font-semibold text-water-700">Keep plot {mine.data.renewal.plotLabel} for {mine.data.renewal.seasonYear}?</h3>
                  <p className="text-soil">
                    Please answer by <strong><LocalDate value={mine.data.renewal.deadline} withTime /></strong>. If you don't, the plot goes to
                    someone on the waiting list.
                  </p>
                </div>
              </div>
              <Link to={paths.renewalAnswer(mine.data.renewal.id)} className={`${buttonClasses('primary')} shrink-0`}>
                Answer the renewal
              </Link>
            </div>
          )}
          {mine.data.holding ? (
            <Card className="space-y-5">
              <div className="flex items-start gap-3">
                <span className="flex size-11 shrink-0 items-center justify-center rounded-lg bg-leaf-50 text-leaf">
                  <Shovel className="size-6" aria-hidden="true" />
                </span>
                <dl className="grid min-w-0 grid-cols-[auto_1fr] gap-x-4 gap-y-1">
                  <dt className="text-stone">Plot</dt>
                  <dd className="font-semibold">{mine.data.holding.label}</dd>
                  <dt className="text-stone">Site</dt>
                  <dd>{mine.data.holding.site.name}</dd>
                  <dt className="text-stone">Size</dt>
                  <dd>
                    {mine.data.holding.size} ({mine.data.holding.area}), {plotKindLabels[mine.data.holding.kind].toLowerCase()}
                  </dd>
                  <dt className="text-stone">Season</dt>
                  <dd>{mine.data.holding.seasonYear}</dd>
                </dl>
              </div>
              <div className="flex flex-col gap-3 sm:flex-row">
                <Link to={paths.plotBook(clubId, mine.data.holding.plotId)} className={`${buttonClasses('primary')} w-full sm:w-auto`}>
                  <BookOpen className="size-5" aria-hidden="true" />
                  Open the plot book
                </Link>
                <Link to={paths.rainGauge(clubId, mine.data.holding.site.id)} className={`${buttonClasses('secondary')} w-full sm:w-auto`}>
                  <CloudRain className="size-5" aria-hidden="true" />
                  Log the rain
                </Link>
              </div>
              <HoldingMap holding={mine.data.holding} />
              {/* Below the map: these lines arrive after it (their own requests), and must not push it down while someone pans it. */}
              {thisWeek?.(mine.data.holding.plotId)}
            </Card>
          ) : (
            <p className="text-stone">You have no plot in this club yet. When the coordinator gives you one, it shows here.</p>
          )}
        </>
      )}
    </section>
  );
}
