import { DndContext, PointerSensor, useSensor, useSensors, type Announcements, type DragEndEvent, type DragMoveEvent } from '@dnd-kit/core';
import { Minus, Plus, SquarePlus, Undo2 } from 'lucide-react';
import { useCallback, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { feetToMetres, footprint, overlaps, snap, type Rect } from '@shared/geometry';
import type { Plot, PlotCreateBody } from '@shared/schemas/plots';
import type { PlotSeasonState } from '@shared/schemas/seasons';
import type { Site } from '@shared/schemas/sites';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { NoticeToast, type Notice } from '@/components/ui/notice-toast';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { useCreatePlot } from '../../api/create-plot';
import { useDeletePlot } from '../../api/delete-plot';
import { useSiteNeighbours } from '../../api/get-site-neighbours';
import { useSitePlots } from '../../api/get-site-plots';
import { useUpdatePlot } from '../../api/update-plot';
import { MapLegend } from './map-legend';
import { dragIdParts, movedWords, resizedWords } from './drag-words';
import { MapBearings, MapCanvas, plotViews, rectOf, tooSmallToLabel, useMapScale, type MapOverlay } from './map-canvas';
import { clampToSite, defaultPlotSize, findFreeSpot, nextLabel, spansToSize } from './map-math';
import { PlotInspector } from './plot-inspector';
import { PlotShape, ResizeHandle, type PlotMark } from './plot-shape';
import { seasonPerson, statusWord } from './season-status';
import { SmallPlotsKey } from './small-plots-key';

export interface MapEditorProps {
  site: Site;
  canEdit: boolean;
  plotHref(plotId: number): string;
  /** A plot to select when the map opens (from a plot page's "Edit on the map"). */
  initialPlotId?: number | null;
  /** The newest season's status of each plot, to show who holds what. */
  seasonStates?: PlotSeasonState[];
  seasonYear?: number;
  /** Drawn over the map by the page (the coordinator's neighbour check). */
  overlay?: MapOverlay;
}

interface DragState {
  kind: 'move' | 'resize';
  plotId: number;
  /** Screen pixels for pointer drags; grid steps are converted to pixels for keyboard moves. */
  dx: number;
  dy: number;
  byKeyboard?: boolean;
}

/** A change that Undo can take back: the plot's values before it, saved again through the normal path. */
interface UndoStep {
  plotId: number;
  label: string;
  /** What the change was, as Undo names it ("the move of plot A-3"). */
  what: 'move' | 'resize' | 'turn' | 'change' | 'addition';
  before: Partial<PlotCreateBody>;
}
/** How many changes Undo remembers. */
const UNDO_LIMIT = 20;

const ARROWS: Record<string, [number, number]> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, -1], ArrowDown: [0, 1] };
/** The smallest side a drag or Shift + arrow leaves a plot with: half a metre, about a small container (common practice). */
const MIN_SIDE = 0.5;
/** What the Alt + arrow step is in metres: 1 m, or 3 ft on a site measured in feet. */
function bigStep(units: Site['units']): number {
  return units === 'us' ? feetToMetres(3) : 1;
}

/** The site map: plots to scale on the site's grid, moved and resized by pointer or keyboard, each change saved at once. */
export function MapEditor({ site, canEdit, plotHref, initialPlotId = null, seasonStates, seasonYear, overlay }: MapEditorProps) {
  const plotsQuery = useSitePlots(site.id);
  const neighboursQuery = useSiteNeighbours(site.id);
  const updatePlot = useUpdatePlot(site.id);
  const createPlot = useCreatePlot(site.id);
  const deletePlot = useDeletePlot(site.id);
  const [selectedId, setSelectedId] = useState<number | null>(initialPlotId);
  const [zoom, setZoom] = useState(1);
  const [drag, setDrag] = useState<DragState | null>(null);
  /** The drag as last drawn: what is saved on release, so the saved size is the one on screen. */
  const shownDrag = useRef<DragState | null>(null);
  const [notice, setNotice] = useState<Notice | null>(null);
  const [undoSteps, setUndoSteps] = useState<UndoStep[]>([]);
  const [undoing, setUndoing] = useState(false);
  /** What the screen reader hears when a pointer drag ends, set by onDragEnd just before dnd-kit asks. */
  const dragEndWords = useRef<string | undefined>(undefined);
  const [wrapRef, scale] = useMapScale(site.width, { zoom, maxScale: 200, fallbackFit: 16 });
  const grid = site.grid > 0 ? site.grid : 0.1;
  const [announcement, setAnnouncement] = useState('');
  // Pointer drags go through dnd-kit; keyboard moves are our own pick-up mode (below), because
  // dnd-kit's keyboard sensor scrolls the page instead of moving when the plot is low on screen.
  const sensors = useSensors(useSensor(PointerSensor, { activationConstraint: { distance: 4 } }));

  const plots = useMemo(() => plotsQuery.data?.items ?? [], [plotsQuery.data]);
  const seasonOf = useMemo(() => new Map((seasonStates ?? []).map((s) => [s.plotId, s])), [seasonStates]);
  const selected = plots.find((p) => p.id === selectedId) ?? null;

  /** Where the plot would go if the current drag ended now: snapped to the grid and kept on the site. */
  const candidate = useCallback(
    (p: Plot, d: DragState | null): Rect => {
      const r = rectOf(p);
      if (!d || d.plotId !== p.id) return r;
      const mx = d.dx / scale;
      const my = d.dy / scale;
      if (d.kind === 'move') return clampToSite({ ...r, x: snap(r.x + mx, grid), y: snap(r.y + my, grid) }, site);
      const fp = footprint(r);
      const spanX = Math.min(Math.max(MIN_SIDE, snap(fp.maxX - fp.minX + mx, grid)), site.width - r.x);
      const spanY = Math.min(Math.max(MIN_SIDE, snap(fp.maxY - fp.minY + my, grid)), site.length - r.y);
      return { ...r, ...spansToSize(r.rotation, spanX, spanY) };
    },
    [grid, scale, site],
  );

  const neighbourIds = useMemo(() => {
    const pairs = neighboursQuery.data?.items ?? [];
    return new Set(pairs.flatMap((n) => (n.a === selectedId ? [n.b] : n.b === selectedId ? [n.a] : [])));
  }, [neighboursQuery.data, selectedId]);

  const neighboursOfSelected = useMemo(() => {
    if (!selected) return [];
    const opposite = { north: 'south', south: 'north', east: 'west', west: 'east' } as const;
    return (neighboursQuery.data?.items ?? [])
      .filter((n) => n.a === selected.id || n.b === selected.id)
      .map((n) => {
        const otherId = n.a === selected.id ? n.b : n.a;
        return {
          plotId: otherId,
          label: plots.find((p) => p.id === otherId)?.label ?? '?',
          side: n.a === selected.id ? n.side : opposite[n.side],
          kind: n.kind,
          gap: n.gap,
        };
      });
  }, [neighboursQuery.data, selected, plots]);

  /** Values sent but not yet answered, per plot: a quick second key press builds on the first, not on the copy from before it. */
  const pending = useRef(new Map<number, { token: number; values: Partial<PlotCreateBody> }>());
  const pendingToken = useRef(0);
  const latest = useCallback((plot: Plot): Plot => ({ ...plot, ...(pending.current.get(plot.id)?.values ?? {}) }) as Plot, []);

  /** Saves a change; with `undoAs`, remembers the plot's earlier values so Undo can put them back. */
  const save = useCallback(
    async (shown: Plot, changes: Partial<PlotCreateBody>, undoAs?: UndoStep['what']) => {
      setNotice(null);
      const plot = latest(shown);
      const before = Object.fromEntries(Object.keys(changes).map((k) => [k, (plot as Record<string, unknown>)[k]])) as Partial<PlotCreateBody>;
      const token = ++pendingToken.current;
      pending.current.set(plot.id, { token, values: { ...pending.current.get(plot.id)?.values, ...changes } });
      try {
        await updatePlot.mutateAsync({ plotId: plot.id, body: { version: plot.version, ...changes } });
      } catch (err) {
        setNotice({ tone: 'error', text: isApiError(err) ? err.message : 'The change could not be saved. Try again.' });
        throw err;
      } finally {
        if (pending.current.get(plot.id)?.token === token) pending.current.delete(plot.id);
      }
      if (undoAs) setUndoSteps((steps) => [...steps, { plotId: plot.id, label: plot.label, what: undoAs, before }].slice(-UNDO_LIMIT));
    },
    [updatePlot, latest],
  );

  const lastStep = undoSteps.at(-1) ?? null;

  /** Takes back the last change through the normal save (the server checks it as usual); a refusal says why. */
  async function undo() {
    const step = lastStep;
    if (!step || undoing) return;
    setUndoSteps((steps) => steps.slice(0, -1));
    const plot = plots.find((p) => p.id === step.plotId);
    const what = `the ${step.what} of plot ${step.label}`;
    if (!plot) {
      setNotice({ tone: 'error', text: `Could not undo ${what}: the plot is no longer on the map.` });
      return;
    }
    setUndoing(true);
    try {
      if (step.what === 'addition') {
        await deletePlot.mutateAsync({ plotId: plot.id, version: plot.version });
        if (selectedId === plot.id) setSelectedId(null);
      } else {
        await save(plot, step.before);
      }
      setNotice({ tone: 'success', text: `Undid ${what}.` });
      setAnnouncement(`Undid ${what}.`);
    } catch (err) {
      setNotice({ tone: 'error', text: `Could not undo ${what}: ${isApiError(err) ? err.message : 'the change was not saved. Try again.'}` });
    } finally {
      setUndoing(false);
    }
  }

  function onDragMove(e: DragMoveEvent) {
    const { kind, id } = dragIdParts(e.active.id);
    const d: DragState = { kind: kind as DragState['kind'], plotId: id, dx: e.delta.x, dy: e.delta.y };
    shownDrag.current = d;
    setDrag(d);
  }

  function onDragEnd(e: DragEndEvent) {
    const { kind, id } = dragIdParts(e.active.id);
    const plot = plots.find((p) => p.id === id);
    const last = shownDrag.current;
    shownDrag.current = null;
    const d: DragState =
      last && last.plotId === id && last.kind === kind ? last : { kind: kind as DragState['kind'], plotId: id, dx: e.delta.x, dy: e.delta.y };
    setDrag(null);
    dragEndWords.current = undefined;
    if (!plot) return;
    setSelectedId(plot.id);
    const to = candidate(plot, d);
    const changes: Partial<PlotCreateBody> =
      kind === 'move' ? { x: to.x, y: to.y } : { width: to.width, length: to.length };
    const changed = Object.entries(changes).some(([k, v]) => (plot as Record<string, unknown>)[k] !== v);
    // The red ring said it would not fit there: put it back rather than send a change that will be refused.
    const inTheWay = plots.find((p) => p.id !== plot.id && overlaps(to, rectOf(p)));
    if (changed && inTheWay) {
      const text = `Plot ${plot.label} was put back: there it would overlap plot ${inTheWay.label}.`;
      dragEndWords.current = text;
      setNotice({ tone: 'error', text });
      return;
    }
    if (!changed) {
      dragEndWords.current = `Plot ${plot.label} put down where it was.`;
      return;
    }
    dragEndWords.current = kind === 'move' ? movedWords(plot.label, to.x, to.y, site.units) : resizedWords(plot.label, to.width, to.length, site.units);
    save(plot, changes, kind === 'move' ? 'move' : 'resize').catch(() => undefined);
  }

  const labelOfDrag = (dragId: string | number) => plots.find((p) => p.id === dragIdParts(dragId).id)?.label ?? '';
  // What a screen reader hears during a pointer drag: plot labels and metres, never internal ids.
  const announcements: Announcements = {
    onDragStart: ({ active }) =>
      dragIdParts(active.id).kind === 'resize' ? `Resizing plot ${labelOfDrag(active.id)}.` : `Plot ${labelOfDrag(active.id)} picked up.`,
    onDragOver: () => undefined,
    onDragEnd: () => dragEndWords.current,
    onDragCancel: ({ active }) => `Plot ${labelOfDrag(active.id)} put back.`,
  };

  /**
   * Keyboard: Space or Enter picks the plot up, arrows move it one grid step (Alt + arrows 1 m),
   * Space or Enter puts it down (saved), Escape puts it back; without picking up, Alt + arrows move
   * it 1 m at once (saved); Shift + arrows resize it (Shift + Alt by 1 m), R turns it.
   * Returns true when the key was handled.
   */
  function onKeyCommand(shown: Plot, e: KeyboardEvent<HTMLElement>): boolean {
    if (!canEdit) return false;
    const plot = latest(shown);
    const d = ARROWS[e.key];
    const carrying = drag?.byKeyboard && drag.plotId === plot.id ? drag : null;
    if (e.key === ' ' || e.key === 'Enter') {
      e.preventDefault();
      if (!carrying) {
        setDrag({ kind: 'move', plotId: plot.id, dx: 0, dy: 0, byKeyboard: true });
        setAnnouncement(`Picked up plot ${plot.label}. Arrow keys move it, Space puts it down, Escape puts it back.`);
        return true;
      }
      setDrag(null);
      const to = candidate(plot, carrying);
      if (to.x !== plot.x || to.y !== plot.y) {
        setAnnouncement(`Plot ${plot.label} put down. ${movedWords(plot.label, to.x, to.y, site.units)}`);
        save(plot, { x: to.x, y: to.y }, 'move').catch(() => undefined);
      } else setAnnouncement(`Plot ${plot.label} put down where it was.`);
      return true;
    }
    if (e.key === 'Escape' && carrying) {
      e.preventDefault();
      setDrag(null);
      setAnnouncement(`Plot ${plot.label} put back.`);
      return true;
    }
    const step = e.altKey ? bigStep(site.units) : grid;
    if (d && carrying) {
      e.preventDefault();
      setDrag({ ...carrying, dx: carrying.dx + d[0] * step * scale, dy: carrying.dy + d[1] * step * scale });
      return true;
    }
    if (d && e.shiftKey) {
      e.preventDefault();
      const r = rectOf(plot);
      const fp = footprint(r);
      const spanX = Math.max(MIN_SIDE, snap(fp.maxX - fp.minX + d[0] * step, grid));
      const spanY = Math.max(MIN_SIDE, snap(fp.maxY - fp.minY + d[1] * step, grid));
      const size = spansToSize(r.rotation, spanX, spanY);
      setAnnouncement(resizedWords(plot.label, size.width, size.length, site.units));
      save(plot, size, 'resize').catch(() => undefined);
      return true;
    }
    if (d && e.altKey) {
      e.preventDefault();
      const to = clampToSite({ ...rectOf(plot), x: snap(plot.x + d[0] * step, grid), y: snap(plot.y + d[1] * step, grid) }, site);
      if (to.x === plot.x && to.y === plot.y) {
        setAnnouncement(`Plot ${plot.label} is at the edge of the site.`);
        return true;
      }
      setAnnouncement(movedWords(plot.label, to.x, to.y, site.units));
      save(plot, { x: to.x, y: to.y }, 'move').catch(() => undefined);
      return true;
    }
    if (e.key === 'r' || e.key === 'R') {
      e.preventDefault();
      save(plot, { rotation: plot.rotation === 0 ? 90 : 0 }, 'turn').catch(() => undefined);
      return true;
    }
    return false;
  }

  async function addPlot() {
    setNotice(null);
    const size = defaultPlotSize(site.units);
    const spot = findFreeSpot(site, plots.map(rectOf), size);
    if (!spot) {
      setNotice({ tone: 'error', text: 'There is no free space left for a new plot of the usual size. Make the site larger or move plots.' });
      return;
    }
    try {
      const created = await createPlot.mutateAsync({ label: nextLabel(plots), ...spot, ...size });
      setSelectedId(created.id);
      setUndoSteps((steps) => [...steps, { plotId: created.id, label: created.label, what: 'addition' as const, before: {} }].slice(-UNDO_LIMIT));
      setNotice({ tone: 'success', text: `Plot ${created.label} added. Drag it into place and give it a label.` });
    } catch (err) {
      setNotice({ tone: 'error', text: isApiError(err) ? err.message : 'The plot could not be added.' });
    }
  }

  if (plotsQuery.isPending) return <LoadingState label="Loading the map…" />;
  if (plotsQuery.isError) {
    return <ErrorState title="The map could not be loaded" message={plotsQuery.error.message} onRetry={() => void plotsQuery.refetch()} />;
  }

  const dragged = drag ? plots.find((p) => p.id === drag.plotId) : undefined;
  const draggedRect = dragged ? candidate(dragged, drag) : null;
  const blocked = Boolean(dragged && draggedRect && plots.some((p) => p.id !== dragged.id && overlaps(draggedRect, rectOf(p))));
  const helpId = `map-help-${site.id}`;
  const smallPlots = tooSmallToLabel(plots, scale, 15, (p) => {
    const season = seasonOf.get(p.id);
    return season ? statusWord(season.status, seasonPerson(season), p.kind) : null;
  });

  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-[1fr_24rem]">
      <div className="min-w-0 space-y-3">
        <div className="flex flex-wrap items-center gap-2">
          {canEdit && (
            <Button onClick={() => void addPlot()} loading={createPlot.isPending} loadingText="Adding…">
              <SquarePlus className="size-5" aria-hidden="true" /> Add plot
            </Button>
          )}
          {canEdit && (
            <Button
              variant="secondary"
              onClick={() => void undo()}
              disabled={!lastStep}
              loading={undoing}
              loadingText="Undoing…"
              aria-label={lastStep ? `Undo the ${lastStep.what} of plot ${lastStep.label}` : 'Undo (nothing to undo yet)'}
              title={lastStep ? `Undo the ${lastStep.what} of plot ${lastStep.label} (Ctrl+Z)` : 'Nothing to undo yet'}
            >
              <Undo2 className="size-5" aria-hidden="true" /> Undo
            </Button>
          )}
          <div className="ml-auto flex items-center gap-1" role="group" aria-label="Zoom">
            <Button variant="secondary" aria-label="Zoom out" onClick={() => setZoom((z) => Math.max(0.5, z / 1.5))}>
              <Minus className="size-5" aria-hidden="true" />
            </Button>
            <Button variant="secondary" aria-label="Zoom in" onClick={() => setZoom((z) => Math.min(8, z * 1.5))}>
              <Plus className="size-5" aria-hidden="true" />
            </Button>
          </div>
        </div>
        <p id={helpId} className="text-sm text-stone">
          {canEdit
            ? `Drag a plot to move it and the round grip to resize it. With the keyboard: Tab to a plot, Space to pick it up, arrows to move it one grid step, Space to put it down (Escape puts it back). Alt + arrows move it ${site.units === 'us' ? '3 ft' : '1 m'} at once; Shift + arrows resize, R turns it, Ctrl+Z undoes the last change.`
            : 'Select a plot to see its details and neighbours.'}
        </p>
        <p className="sr-only" aria-live="assertive">
          {announcement}
        </p>
        <NoticeToast notice={notice} onDismiss={() => setNotice(null)} />
        {overlay?.controls}
        {/* No auto-scroll: scrolling the page under a drag moved the plot further than the pointer and ran it off the map. */}
        <DndContext
          sensors={sensors}
          autoScroll={false}
          accessibility={{
            announcements,
            screenReaderInstructions: {
              draggable:
                'Drag the grip with a pointer to resize the plot. With the keyboard, Tab to the plot and press Shift with the arrow keys.',
            },
          }}
          onDragMove={onDragMove}
          onDragEnd={onDragEnd}
          onDragCancel={() => setDrag(null)}
        >
          <MapCanvas
            site={site}
            scale={scale}
            frameRef={wrapRef}
            label={`Map of ${site.name}`}
            plots={plots}
            onKeyDown={(e) => {
              // Ctrl+Z (Cmd+Z on a Mac) while the map has focus takes back the last change.
              if (canEdit && (e.ctrlKey || e.metaKey) && !e.shiftKey && !e.altKey && e.key.toLowerCase() === 'z' && !drag) {
                e.preventDefault();
                void undo();
              }
            }}
            renderPlot={(p) => {
              let mark: PlotMark = null;
              if (drag?.plotId === p.id && blocked) mark = 'blocked';
              else if (p.id === selectedId) mark = 'selected';
              else if (neighbourIds.has(p.id)) mark = 'neighbour';
              return (
                <PlotShape
                  plot={p}
                  rect={candidate(p, drag)}
                  scale={scale}
                  mark={mark}
                  canEdit={canEdit}
                  describedBy={helpId}
                  season={seasonOf.get(p.id)}
                  onSelect={() => setSelectedId(p.id)}
                  onBlur={() => {
                    if (drag?.byKeyboard && drag.plotId === p.id) setDrag(null);
                  }}
                  onKeyCommand={(e) => onKeyCommand(p, e)}
                />
              );
            }}
          >
            {canEdit && selected && <ResizeHandle plot={selected} rect={candidate(selected, drag)} scale={scale} />}
            {overlay?.marks?.({ plots: plotViews(plots), scale, width: site.width * scale })}
          </MapCanvas>
        </DndContext>
        {/* Below the map, so it never moves the map under the pointer during a drag. */}
        <p className="min-h-6 font-medium text-clay-700" role="status">
          {blocked ? 'Here it would overlap another plot: plots may touch but not overlap.' : ''}
        </p>
        <SmallPlotsKey plots={smallPlots} canZoom />
        <div className="flex flex-wrap items-center justify-between gap-3">
          <MapBearings scale={scale} units={site.units} />
          <span className="text-sm text-stone">
            {plots.length} plots · path width {site.units === 'us' ? `${Math.round((site.pathWidth / 0.3048) * 10) / 10} ft` : `${site.pathWidth} m`}
          </span>
        </div>
        <MapLegend seasonYear={seasonStates ? seasonYear : undefined} />
        {overlay?.legend}
      </div>
      <div className="h-fit space-y-4 lg:sticky lg:top-4">
        {overlay?.panel}
        <Card className="p-4">
          {selected ? (
            <PlotInspector
              key={`${selected.id}-${selected.version}`}
              plot={selected}
              units={site.units}
              canEdit={canEdit}
              neighbours={neighboursOfSelected}
              plotHref={plotHref(selected.id)}
              onSave={(changes) => save(selected, changes, 'change')}
              onRotate={() => void save(selected, { rotation: selected.rotation === 0 ? 90 : 0 }, 'turn').catch(() => undefined)}
              onDelete={async () => {
                try {
                  await deletePlot.mutateAsync({ plotId: selected.id, version: selected.version });
                  setNotice({ tone: 'success', text: `Plot ${selected.label} was removed from the map.` });
                  setSelectedId(null);
                } catch (err) {
                  setNotice({ tone: 'error', text: isApiError(err) ? err.message : 'The plot could not be removed.' });
                }
              }}
            />
          ) : plots.length === 0 ? (
            <div>
              <h2 className="text-xl font-semibold">An empty site</h2>
              <p className="mt-1 text-stone">
                {canEdit ? 'Add the first plot, or import a plan from a CSV file on the plots page.' : 'No plots have been drawn yet.'}
              </p>
            </div>
          ) : (
            <div>
              <h2 className="text-xl font-semibold">No plot selected</h2>
              <p className="mt-1 text-stone">Select a plot on the map to see its size, soil and neighbours.</p>
            </div>
          )}
        </Card>
      </div>
    </div>
  );
}
