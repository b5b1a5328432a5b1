import {
  DndContext,
  DragOverlay,
  MeasuringStrategy,
  PointerSensor,
  pointerWithin,
  useDraggable,
  useDroppable,
  useSensor,
  useSensors,
  type Announcements,
  type DragEndEvent,
} from '@dnd-kit/core';
import { Accessibility, GripVertical, Hourglass, UserRound } from 'lucide-react';
import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { formatArea, formatLength } from '@shared/geometry';
import { plotKindLabels, type Plot } from '@shared/schemas/plots';
import { formatMoney } from '@shared/fees/compute';
import { plotSeasonStatusLabels, type OfferQuote, type PlotSeasonState, type PlotSeasonStatus } from '@shared/schemas/seasons';
import type { Site } from '@shared/schemas/sites';
import { meetsNeeds, suggestApplicant, type SuggestPerson } from '@shared/spring-round/suggest';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Dialog } from '@/components/ui/dialog';
import { ErrorState } from '@/components/ui/error-state';
import { Select } from '@/components/ui/select';
import { NoticeToast, type Notice } from '@/components/ui/notice-toast';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { useSitePlots } from '../../api/get-site-plots';
import { dragIdParts } from './drag-words';
import { MapBearings, MapCanvas, plotViews, PlotTileView, rectOf, tooSmallToLabel, useMapScale, type MapOverlay } from './map-canvas';
import { SmallPlotsKey } from './small-plots-key';
import { seasonPerson, statusClasses, statusWord } from './season-status';
import { LocalDate } from '@/lib/time-zone';

/** Someone on the waiting list, as the allocation map shows them. */
export interface AllocationPerson extends SuggestPerson {
  name: string;
  position: number | null;
  detail: string;
}

export interface AllocationMapProps {
  site: Site;
  states: PlotSeasonState[];
  people: AllocationPerson[];
  plotHref(plotId: number): string;
  /** What the offer would say, for the confirm step (nothing is sent). */
  onQuote(plotId: number, personId: number): Promise<OfferQuote>;
  onOffer(plotId: number, personId: number): Promise<unknown>;
  onWithdraw(offerId: number): Promise<unknown>;
  /** Drawn over the map by the page (the coordinator's neighbour check). */
  overlay?: MapOverlay;
}


function fits(person: AllocationPerson, plot: Plot, siteId: number) {
  return meetsNeeds(person, { ...plot, siteId });
}

function PlotTile({ plot, state, scale, selected, onSelect }: { plot: Plot; state: PlotSeasonState | undefined; scale: number; selected: boolean; onSelect(): void }) {
  const status = state?.status ?? 'free';
  const { setNodeRef, isOver } = useDroppable({ id: `plot:${plot.id}`, disabled: status !== 'free' || plot.kind === 'shared_bed' });
  return (
    <PlotTileView
      as="button"
      ref={setNodeRef}
      type="button"
      plot={plot}
      rect={rectOf(plot)}
      scale={scale}
      status={status}
      who={seasonPerson(state)}
      maxPx={14}
      onClick={onSelect}
      aria-pressed={selected}
      data-drop-over={isOver ? 'true' : undefined}
      className={`${selected ? 'z-20 ring-4 ring-leaf' : ''} ${isOver ? 'z-20 ring-4 ring-water' : ''}`}
    />
  );
}

function PersonChip({ person, suggested, fitsSelected, describedBy }: { person: AllocationPerson; suggested: boolean; fitsSelected: boolean | null; describedBy: string }) {
  const { attributes, listeners, setNodeRef, isDragging } = useDraggable({ id: `person:${person.id}` });
  // The chip's name is its visible text (place, name, details); how to drag it is its description.
  return (
    <li>
      <div
        ref={setNodeRef}
        {...attributes}
        {...listeners}
        aria-describedby={describedBy}
        aria-roledescription="draggable person"
        className={`flex min-h-12 cursor-grab touch-none items-center gap-2 rounded-lg border bg-white px-2 py-1.5 ${
          suggested ? 'border-leaf ring-2 ring-leaf' : 'border-paper-300'
        } ${isDragging ? 'opacity-40' : ''}`}
      >
        <GripVertical className="size-4 shrink-0 text-stone" aria-hidden="true" />
        <span className="w-7 shrink-0 text-right font-semibold tabular-nums">{person.position ?? '–'}</span>{' '}
        <span className="min-w-0 flex-1">
          <span className="block truncate font-medium">{person.name}</span>{' '}
          <span className="block truncate text-sm text-stone">
            {person.detail}
            {fitsSelected === false && ' · does not match this plot'}
          </span>
        </span>
        {person.needsAccessible && <Accessibility className="size-4 shrink-0 text-water-700" aria-label="needs an accessible bed" role="img" />}
        {suggested && <span className="shrink-0 rounded-full bg-leaf px-2 py-0.5 text-xs font-semibold text-white">next</span>}
      </div>
    </li>
  );
}

/** The spring-round map: plots coloured and labelled by their status, and the waiting list to drag onto free plots. */
export function AllocationMap({ site, states, people, plotHref, onQuote, onOffer, onWithdraw, overlay }: AllocationMapProps) {
  const plotsQuery = useSitePlots(site.id);
  const [wrapRef, scale] = useMapScale(site.width, { fallbackFit: 600 / site.width });
  const [selectedId, setSelectedId] = useState<number | null>(null);
  const [choice, setChoice] = useState<string>('');
  const [dragging, setDragging] = useState<AllocationPerson | null>(null);
  const [notice, setNotice] = useState<Notice | null>(null);
  const [busy, setBusy] = useState(false);
  /** An offer waiting for the coordinator's yes, with what it would say. */
  const [confirming, setConfirming] = useState<{ plotId: number; personId: number; quote: OfferQuote } | null>(null);
  const sensors = useSensors(useSensor(PointerSensor, { activationConstraint: { distance: 4 } }));

  const plots = useMemo(() => plotsQuery.data?.items ?? [], [plotsQuery.data]);
  const stateOf = useMemo(() => new Map(states.map((s) => [s.plotId, s])), [states]);
  const selected = plots.find((p) => p.id === selectedId) ?? null;
  const selectedState = selected ? stateOf.get(selected.id) : undefined;
  const suggested = selected && selectedState?.status === 'free' ? suggestApplicant({ ...selected, siteId: site.id }, people) : null;

  /** First step of an offer (drop or menu): fetch what it would say and ask before anything is sent. */
  async function askToOffer(plotId: number, personId: number) {
    setNotice(null);
    setBusy(true);
    try {
      setConfirming({ plotId, personId, quote: await onQuote(plotId, personId) });
    } catch (err) {
      setNotice({ tone: 'error', text: isApiError(err) ? err.message : 'The offer could not be prepared. Try again.' });
    } finally {
      setBusy(false);
    }
  }

  async function sendOffer() {
    if (!confirming) return;
    const { plotId, personId, quote } = confirming;
    setBusy(true);
    try {
      await onOffer(plotId, personId);
      setConfirming(null);
      setNotice({ tone: 'success', text: `Plot ${quote.plotLabel} offered to ${quote.personName}. The offer e-mail is on its way.` });
      setChoice('');
    } catch (err) {
      setConfirming(null);
      setNotice({ tone: 'error', text: isApiError(err) ? err.message : 'The offer could not be made. Try again.' });
    } finally {
      setBusy(false);
    }
  }

  function onDragEnd(e: DragEndEvent) {
    setDragging(null);
    const personId = dragIdParts(e.active.id).id;
    const overId = e.over ? dragIdParts(e.over.id).id : null;
    if (overId === null) return;
    setSelectedId(overId);
    void askToOffer(overId, personId);
  }

  const labelOf = (id: string | number) => {
    const { kind, id: n } = dragIdParts(id);
    if (kind === 'person') return people.find((p) => p.id === n)?.name ?? 'The person';
    return `plot ${plots.find((p) => p.id === n)?.label ?? ''}`.trim();
  };
  // What a screen reader hears during a drag: names, never internal ids.
  const announcements: Announcements = {
    onDragStart: ({ active }) => `Picked up ${labelOf(active.id)}.`,
    onDragOver: ({ active, over }) => (over ? `${labelOf(active.id)} is over ${labelOf(over.id)}.` : `${labelOf(active.id)} is over no free plot.`),
    onDragEnd: ({ active, over }) => (over ? `${labelOf(active.id)} dropped on ${labelOf(over.id)}.` : `${labelOf(active.id)} dropped outside the free plots.`),
    onDragCancel: ({ active }) => `${labelOf(active.id)} put back on the waiting list.`,
  };

  if (plotsQuery.isPending) return <LoadingState label="Loading the map…" />;
  if (plotsQuery.isError) return <ErrorState title="The map could not be loaded" message={plotsQuery.error.message} onRetry={() => void plotsQuery.refetch()} />;

  const counts = plots.reduce<Record<PlotSeasonStatus, number>>(
    (acc, p) => ({ ...acc, [stateOf.get(p.id)?.status ?? 'free']: acc[stateOf.get(p.id)?.status ?? 'free'] + 1 }),
    { free: 0, renewal_pending: 0, offered: 0, taken: 0 },
  );

  const smallPlots = tooSmallToLabel(plots, scale, 14, (p) => {
    const state = stateOf.get(p.id);
    return statusWord(state?.status ?? 'free', seasonPerson(state), p.kind);
  });

  return (
    <DndContext
      sensors={sensors}
      // The plot under the pointer is the target, not the one the dragged chip overlaps most.
      collisionDetection={pointerWithin}
      // Plots are measured afresh during the drag and the page does not scroll under it, so the
      // drop zones stay where the plots are drawn after any scroll or zoom.
      measuring={{ droppable: { strategy: MeasuringStrategy.Always } }}
      autoScroll={false}
      accessibility={{ announcements }}
      onDragStart={(e) => setDragging(people.find((p) => `person:${p.id}` === e.active.id) ?? null)}
      onDragEnd={onDragEnd}
      onDragCancel={() => setDragging(null)}
    >
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-[1fr_22rem]">
        <div className="min-w-0 space-y-3">
          <NoticeToast notice={notice} onDismiss={() => setNotice(null)} />
          <p id={`drag-help-${site.id}`} className="text-sm text-stone">
            Drag a person from the waiting list onto a free plot to send them an offer, or select a plot and choose a person
            below the map.
          </p>
          {overlay?.controls}
          <MapCanvas
            site={site}
            scale={scale}
            frameRef={wrapRef}
            label={`Spring round map of ${site.name}`}
            plots={plots}
            renderPlot={(p) => <PlotTile plot={p} state={stateOf.get(p.id)} scale={scale} selected={p.id === selectedId} onSelect={() => setSelectedId(p.id)} />}
          >
            {overlay?.marks?.({ plots: plotViews(plots), scale, width: site.width * scale })}
          </MapCanvas>
          <SmallPlotsKey plots={smallPlots} canZoom={false} />
          <div className="flex flex-wrap items-center justify-between gap-3">
            <MapBearings scale={scale} units={site.units} />
            <ul className="flex flex-wrap gap-x-4 gap-y-1 text-sm" aria-label="Plot status legend">
              {(Object.keys(statusClasses) as PlotSeasonStatus[]).map((s) => (
                <li key={s} className="flex items-center gap-1.5">
                  <span className={`inline-block size-4 rounded-sm border-2 border-soil/70 ${statusClasses[s]}`} aria-hidden="true" />
                  {plotSeasonStatusLabels[s]} ({counts[s]})
                </li>
              ))}
            </ul>
          </div>
          {overlay?.legend}
          {selected && (
            <Card className="space-y-3 p-4">
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <h3 className="text-lg font-semibold">
                  Plot {selected.label}: {plotSeasonStatusLabels[selectedState?.status ?? 'free']}
                </h3>
                <Link to={plotHref(selected.id)}>Plot page and history</Link>
              </div>
              <p className="text-stone">
                {plotKindLabels[selected.kind]} · {formatLength(selected.width, site.units)} × {formatLength(selected.length, site.units)} ·{' '}
                {formatArea(selected.area, site.units)}
                {selected.isAccessible ? ' · wheelchair height' : ''}
              </p>
              {selectedState?.holder && <p>Held by {selectedState.holder.name}.</p>}
              {selectedState?.renewal && (
                <p>
                  Waiting for {selectedState.renewal.name} to keep or give it up (by <LocalDate value={selectedState.renewal.deadline} />).
                </p>
              )}
              {selectedState?.offer && (
                <div className="flex flex-wrap items-center gap-3">
                  <p className="flex items-center gap-2">
                    <Hourglass className="size-4" aria-hidden="true" /> Offered to {selectedState.offer.name}, answer by{' '}
                    <LocalDate value={selectedState.offer.deadline} withTime />.
                  </p>
                  <Button variant="secondary" disabled={busy} onClick={() => void onWithdraw(selectedState.offer!.id).then(() => setNotice({ tone: 'success', text: 'Offer withdrawn.' }))}>
                    Withdraw offer
                  </Button>
                </div>
              )}
              {selected.kind === 'shared_bed' && <p className="text-stone">A shared bed: the club tends it together, so it is not offered to one person.</p>}
              {(selectedState?.status ?? 'free') === 'free' && selected.kind !== 'shared_bed' && (
                <form
                  className="flex flex-wrap items-end gap-3"
                  onSubmit={(e) => {
                    e.preventDefault();
                    const id = Number(choice || suggested?.id);
                    if (id) void askToOffer(selected.id, id);
                  }}
                >
                  <Select label="Offer to" value={choice || String(suggested?.id ?? '')} onChange={(e) => setChoice(e.target.value)} className="min-w-0 flex-1 basis-64">
                    <option value="" disabled>
                      {people.length ? 'Choose a person' : 'Nobody is waiting'}
                    </option>
                    {people.map((p) => (
                      <option key={p.id} value={p.id}>
                        {p.position ? `${p.position}. ` : ''}
                        {p.name}
                        {p.id === suggested?.id ? ' (next who fits)' : fits(p, selected, site.id) ? '' : ' (does not match)'}
                      </option>
                    ))}
                  </Select>
                  <Button type="submit" loading={busy} loadingText="Sending…" disabled={!people.length}>
                    Offer plot {selected.label}
                  </Button>
                </form>
              )}
            </Card>
          )}
        </div>
        <div className="h-fit min-w-0 space-y-4 lg:sticky lg:top-4">
          {overlay?.panel}
          <Card className="min-w-0 p-4">
            <h2 className="flex items-center gap-2 text-xl font-semibold">
              <UserRound className="size-5" aria-hidden="true" /> Waiting list
            </h2>
            <p className="mb-3 text-sm text-stone">
              In order of application. {suggested ? `For plot ${selected?.label}, the next who fits is ${suggested.name}.` : 'Select a free plot to see who fits it.'}
            </p>
            {people.length === 0 ? (
              <p className="text-stone">Nobody is waiting for a plot.</p>
            ) : (
              <ul className="max-h-[32rem] space-y-2 overflow-y-auto pr-1" aria-label="People waiting for a plot">
                {people.map((p) => (
                  <PersonChip
                    key={p.id}
                    person={p}
                    suggested={p.id === suggested?.id}
                    describedBy={`drag-help-${site.id}`}
                    fitsSelected={selected && selectedState?.status === 'free' ? fits(p, selected, site.id) : null}
                  />
                ))}
              </ul>
            )}
          </Card>
        </div>
      </div>
      <Dialog
        open={confirming !== null}
        onClose={() => setConfirming(null)}
        title={confirming ? `Offer plot ${confirming.quote.plotLabel} to ${confirming.quote.personName}?` : 'Send this offer?'}
        description="Sending e-mails the offer with links to accept or decline."
      >
        {confirming && (
          <div className="space-y-4">
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
              <dt className="font-medium">To</dt>
              <dd>
                {confirming.quote.personName} ({confirming.quote.personEmail})
              </dd>
              <dt className="font-medium">Plot</dt>
              <dd>
                {confirming.quote.plotLabel} at {confirming.quote.siteName}
              </dd>
              <dt className="font-medium">Answer by</dt>
              <dd>
                <LocalDate value={confirming.quote.deadline} withTime /> ({confirming.quote.offerDays} days)
              </dd>
              <dt className="font-medium">Fee</dt>
              <dd>
                {formatMoney(confirming.quote.fee.plotFeeMinor, confirming.quote.fee.currency)}
                {confirming.quote.fee.depositMinor > 0 &&
                  ` plus a refundable deposit of ${formatMoney(confirming.quote.fee.depositMinor, confirming.quote.fee.currency)}`}
              </dd>
            </dl>
            {!confirming.quote.fitsNeeds && (
              <Alert tone="warning">This plot does not meet everything {confirming.quote.personName} asked for.</Alert>
            )}
            <div className="flex flex-wrap justify-end gap-2">
              <Button variant="secondary" onClick={() => setConfirming(null)}>
                Cancel
              </Button>
              <Button onClick={() => void sendOffer()} loading={busy} loadingText="Sending…">
                Send the offer
              </Button>
            </div>
          </div>
        )}
      </Dialog>
      <DragOverlay>
        {dragging && (
          <div className="rounded-lg border-2 border-leaf bg-white px-3 py-2 font-medium shadow-lg">{dragging.name}</div>
        )}
      </DragOverlay>
    </DndContext>
  );
}
