import { useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { ArrowLeft, BookOpen, Bug, Lock, Plus, SearchX } from 'lucide-react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DeadEnd } from '@/components/ui/dead-end';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { usePlotBook } from '../api/get-plot-book';
import { areaText, calendarDate, partText, plantingName, statusWords } from '../lib/format';
import { HarvestFigures } from './harvest-figures';
import type { NeighbourCheckSlots, TasksSlot } from './neighbour-check-slots';
import { ObservationForm } from './observation-form';
import { ObservationsList } from './observations-list';
import { PartPicker } from './part-picker';
import { PlantingCard } from './planting-card';
import { PlantingForm } from './planting-form';
import { PlotDrawing } from './plot-drawing';

function Section({ id, title, action, children }: { id: string; title: string; action?: ReactNode; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="flex min-w-0 flex-col gap-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id={id} className="text-xl font-semibold">
          {title}
        </h2>
        {action}
      </div>
      {children}
    </section>
  );
}

export interface PlotBookPageProps {
  clubId: number;
  /** From the URL; NaN when it holds no number. */
  plotId: number;
  year?: number;
  /** Coordinators come back to the plot page; holders to their home. */
  isCoordinator: boolean;
  /** The neighbour check's parts (src/app hands them in from the findings feature). */
  neighbourCheck?: NeighbourCheckSlots;
  /** The season's tasks (src/app hands them in from the tasks feature); shown for the current season only. */
  Tasks?: TasksSlot;
}

/** A plot's plot book: the plot with this season's plantings drawn on it, their dates and harvests, pests and diseases, earlier seasons. */
export function PlotBookPage({ clubId, plotId, year, isCoordinator, neighbourCheck, Tasks }: PlotBookPageProps) {
  const book = usePlotBook(plotId, year);
  const [adding, setAdding] = useState(false);
  const [observing, setObserving] = useState(false);
  const [saved, setSaved] = useState<string | null>(null);

  if (!Number.isInteger(plotId) || plotId <= 0 || isApiError(book.error, 404) || isApiError(book.error, 400)) {
    return (
      <DeadEnd clubId={clubId} icon={SearchX} title="We can't find that plot book">
        <p>The plot may have been taken off the map, or the link belongs to another club.</p>
      </DeadEnd>
    );
  }
  if (isApiError(book.error, 403)) {
    return (
      <DeadEnd clubId={clubId} icon={Lock} title="This plot book is its holder's">
        <p>The club keeps plot books private to each holder and the coordinators.</p>
      </DeadEnd>
    );
  }
  if (book.isPending) return <LoadingState label="Opening the plot book…" />;
  if (book.isError) {
    return (
      <ErrorState
        message={book.error.message}
        requestId={isApiError(book.error) ? book.error.requestId : undefined}
        onRetry={() => void book.refetch()}
        retrying={book.isFetching}
      />
    );
  }

  const b = book.data;
  const { plot } = b;
  const units = plot.units;
  const writable = b.canWrite && (b.season?.isCurrent ?? false);
  const drawn = b.plantings.map((p) => ({ id: p.id, part: p.part, label: p.crop.commonName }));
  // Keep reasons are the holder's words to the coordinators; other members reading the book do not see them.
  const showKeptReasons = isCoordinator || b.canWrite;
  const plantingsStamp = b.plantings.map((p) => `${p.id}:${p.version}`).join(',');
  const years = [...new Set([...(b.season ? [b.season.year] : []), ...b.pastSeasons.map((s) => s.year)])].sort((a, z) => z - a);

  return (
    <>
      <title>{`Plot book ${plot.label} · ${plot.siteName} · Tillwell`}</title>
      <Link to={isCoordinator ? paths.plot(clubId, plot.id) : paths.club(clubId)} className="mb-4 inline-flex min-h-11 items-center gap-1.5 font-medium">
        <ArrowLeft className="size-5" aria-hidden="true" />
        {isCoordinator ? `Plot ${plot.label}` : 'Home'}
      </Link>
      <PageHeader
        eyebrow={plot.siteName}
        title={`Plot book: ${plot.label}`}
        description={`${b.season ? `The ${b.season.year} season` : 'No season yet'} · ${areaText(plot.width * plot.length, units)}`}
      />
      {years.length > 1 && (
        <nav aria-label="Seasons" className="mb-6 flex flex-wrap gap-2">
          {years.map((y) => (
            <Link
              key={y}
              to={paths.plotBook(clubId, plot.id, b.season?.isCurrent && y === b.season.year ? undefined : y)}
              aria-current={b.season?.year === y ? 'page' : undefined}
              className="inline-flex min-h-11 items-center rounded-full border border-stone px-4 font-medium aria-[current=page]:border-leaf aria-[current=page]:bg-leaf aria-[current=page]:text-white"
            >
              {y}
            </Link>
          ))}
        </nav>
      )}
      {saved && (
        <Alert tone="success" className="mb-6">
          {saved}
        </Alert>
      )}
      {!b.season ? (
        <EmptyState icon={BookOpen} title="No season yet">
          <p>The plot book opens with the club's first season.</p>
        </EmptyState>
      ) : (
        <div className="flex flex-col gap-10">
          <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
            <Card>
              <PlotDrawing
                width={plot.width}
                length={plot.length}
                parts={drawn}
                title={`Plot ${plot.label} with ${b.plantings.length} plantings drawn where they grow, north up`}
              />
              <p className="mt-2 text-sm text-stone">North is up, as on the map. Dashed: a planting over the whole plot.</p>
            </Card>
            <Section
              id="plantings"
              title={`Plantings in ${b.season.year}`}
              action={
                writable &&
                !adding && (
                  <Button onClick={() => setAdding(true)}>
                    <Plus className="size-5" aria-hidden="true" />
                    Add a planting
                  </Button>
                )
              }
            >
              {adding && (
                <Card>
                  <h3 className="mb-4 text-lg font-semibold">New planting</h3>
                  <PlantingForm
                    clubId={clubId}
                    plot={{ id: plot.id, width: plot.width, length: plot.length, units }}
                    others={drawn}
                    onSaved={(p) => {
                      setAdding(false);
                      setSaved(`${plantingName(p)} saved. Its dates are below.`);
                    }}
                    onCancel={() => setAdding(false)}
                    Check={neighbourCheck?.PlantingCheck}
                  />
                </Card>
              )}
              {b.plantings.length === 0 && !adding && (
                <p className="text-stone">{writable ? 'Nothing planted yet this season. Add what you sow or plant out.' : 'Nothing recorded for this season.'}</p>
              )}
              {b.plantings.map((p) => (
                <PlantingCard key={p.id} planting={p} harvests={b.harvests} plotId={plot.id} units={units} canWrite={writable} />
              ))}
            </Section>
          </div>

          {Tasks && b.season.isCurrent && (
            <Section id="tasks" title="Tasks">
              <Tasks clubId={clubId} plotId={plot.id} plotLabel={plot.label} siteId={plot.siteId} siteName={plot.siteName} />
            </Section>
          )}

          {neighbourCheck && (
            <Section id="neighbour-check" title="Neighbour check">
              <p className="-mt-2 max-w-prose text-sm text-stone">
                How this season's plantings sit with what grew here before, with each other and with the neighbours' plots.
              </p>
              <neighbourCheck.NeighbourCheck
                findings={b.findings}
                plantings={b.plantings.map((p) => ({ id: p.id, name: plantingName(p) }))}
                showKeptReasons={showKeptReasons}
              />
            </Section>
          )}

          {neighbourCheck && writable && (
            <Section id="what-fits" title="What fits here">
              <p className="-mt-2 max-w-prose text-sm text-stone">
                The club's crops weighed for this plot on the day you would sow or plant out, good choices first. Open a crop to see why.
              </p>
              <Card>
                <neighbourCheck.WhatFits
                  plotId={plot.id}
                  plantingsStamp={plantingsStamp}
                  showKeptReasons={showKeptReasons}
                  renderPartPicker={(value, onChange) => (
                    <PartPicker plot={{ width: plot.width, length: plot.length, units }} value={value} onChange={onChange} others={drawn} />
                  )}
                />
              </Card>
            </Section>
          )}

          <Section
            id="observations"
            title="Pests and diseases"
            action={
              b.canWrite &&
              !observing && (
                <Button variant="secondary" onClick={() => setObserving(true)}>
                  <Bug className="size-5" aria-hidden="true" />
                  Record what you saw
                </Button>
              )
            }
          >
            {observing && (
              <Card>
                <ObservationForm
                  plotId={plot.id}
                  plantings={b.plantings}
                  onDone={() => setObserving(false)}
                />
              </Card>
            )}
            <ObservationsList observations={b.observations} plantings={[...b.plantings, ...b.pastSeasons.flatMap((s) => s.plantings)]} />
          </Section>

          <Section id="harvest" title={`Harvest in ${b.season.year}`}>
            <HarvestFigures book={b} plantings={b.plantings} />
          </Section>

          {b.pastSeasons.length > 0 && (
            <Section id="earlier" title="Earlier seasons">
              <div className="grid gap-4 md:grid-cols-2">
                {b.pastSeasons.map((s) => (
                  <Card key={s.year}>
                    <h3 className="mb-2 text-lg font-semibold">
                      <Link to={paths.plotBook(clubId, plot.id, s.year)} className="inline-flex min-h-11 min-w-11 items-center">{s.year}</Link>
                    </h3>
                    {s.plantings.length === 0 ? (
                      <p className="text-stone">Nothing recorded.</p>
                    ) : (
                      <ul className="flex flex-col gap-2">
                        {s.plantings.map((p) => (
                          <li key={p.id}>
                            <span className="font-medium">{plantingName(p)}</span>
                            <span className="block text-sm text-stone">
                              {p.crop.family} · {partText(p.part, units)} · {calendarDate(p.plantedOn)} · {statusWords[p.status]}
                            </span>
                          </li>
                        ))}
                      </ul>
                    )}
                  </Card>
                ))}
              </div>
            </Section>
          )}
        </div>
      )}
    </>
  );
}
