import { ScanSearch, X } from 'lucide-react';
import { useId, useMemo, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { footprint, type Rect } from '@shared/geometry';
import type { FindingList } from '@shared/schemas/findings';
import type { Plot } from '@shared/schemas/plots';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { useSiteFindings } from '../api/get-site-findings';
import {
  cautionFor,
  countBySeverity,
  countsSentence,
  evidenceLabel,
  kindLabels,
  severityCount,
  severityLabels,
  severityOrder,
} from '../lib/finding-words';
import { SeveritySymbol, SeverityTag } from './severity-symbol';

type SiteFinding = FindingList['items'][number];

/** What a map hands an overlay: its plots where they are drawn, and its px per metre. */
export interface OverlayView {
  plots: Array<{ plot: Plot; rect: Rect }>;
  scale: number;
  /** The canvas's width in px. */
  width: number;
}

export interface NeighbourCheckOptions {
  siteId: number;
  /** The season whose plantings are checked; null when the club has none (the toggle then says so), undefined while that is not known yet. */
  seasonId: number | null | undefined;
  seasonYear?: number;
  /** The plot book of a plot for that season, linked from the panel. */
  plotBookHref?(plotId: number): string;
}

/** One finding as the panel shows it: severity in shape and word, what it is, why, who with, from where, and a kept reason. */
export function FindingCard({ finding, showPlot = false }: { finding: SiteFinding; showPlot?: boolean }) {
  const caution = cautionFor(finding.title, finding.message);
  return (
    <li className="space-y-1 rounded-lg border border-paper-200 bg-white p-3">
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <SeverityTag severity={finding.severity} />
        <span className="text-sm text-stone">
          {kindLabels[finding.kind]} · {finding.cropName}
          {showPlot ? ` on ${finding.plotLabel}` : ''}
        </span>
      </div>
      <p className="font-semibold">{finding.title}</p>
      <p>{finding.message}</p>
      {finding.peers.length > 0 && (
        <p className="text-sm text-stone">
          With {finding.peers.map((p) => `${p.cropName} on ${p.plotLabel} (${p.seasonYear})`).join('; ')}.
        </p>
      )}
      <p className="text-sm text-stone">
        Source:{' '}
        {finding.source.url ? (
          <a href={finding.source.url} target="_blank" rel="noreferrer">
            {finding.source.title}
          </a>
        ) : (
          finding.source.title
        )}{' '}
        ({evidenceLabel(finding.source.evidence)})
      </p>
      {finding.keptReason && (
        <p className="text-sm">
          <span className="font-medium">Kept by the holder:</span> {finding.keptReason}
        </p>
      )}
      {caution && <p className="text-sm text-clay-700">{caution}</p>}
    </li>
  );
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** "5 findings on 3 plots in 2027: 1 clash, 4 to watch." or "Nothing found on this site's plantings in 2027." */
function summary(items: SiteFinding[], plots: number, year: number | null | undefined): string {
  const inYear = year ? ` in ${year}` : '';
  if (items.length === 0) return `Nothing found on this site’s plantings${inYear}.`;
  return `${plural(items.length, 'finding', 'findings')} on ${plural(plots, 'plot', 'plots')}${inYear}: ${countsSentence(countBySeverity(items))}.`;
}

/** The symbols of the neighbour check explained in our own words, with the marks as drawn on the map. */
export function NeighbourCheckLegend() {
  const rows: Array<[ReactNode, string, string]> = [
    [<SeveritySymbol key="c" severity="clash" className="size-5" />, severityLabels.clash, 'this planting goes against something the check looks at, such as the same crop family back in a bed sooner than the club’s rotation gap. Change it, or say why it stays.'],
    [<SeveritySymbol key="w" severity="watch" className="size-5" />, severityLabels.watch, 'not wrong, but worth a look before it goes in: a tall neighbour that may shade it, or a pairing the notes are unsure about.'],
    [<SeveritySymbol key="g" severity="good" className="size-5" />, severityLabels.good, 'neighbours the notes list as doing well side by side.'],
  ];
  return (
    <section aria-label="Neighbour check legend" className="rounded-lg border border-paper-200 bg-white p-3 text-sm">
      <h3 className="mb-2 font-semibold">Reading the neighbour check</h3>
      <ul className="space-y-1.5">
        {rows.map(([symbol, word, text]) => (
          <li key={word} className="flex items-start gap-2">
            {symbol}
            <span>
              <span className="font-semibold">{word}</span>: {text}
            </span>
          </li>
        ))}
        <li className="flex items-start gap-2">
          <span className="inline-flex h-6 shrink-0 items-center gap-0.5 rounded-full border-2 border-soil/60 bg-white px-1 text-xs font-bold" aria-hidden="true">
            <SeveritySymbol severity="clash" className="size-3.5" />2
          </span>
          <span>
            The mark on a plot&apos;s corner counts its findings of each kind: here, two clashes. On a plot too narrow for every count, the mark
            shows the worst kind and the total. Select a mark, or Tab to it, to read them beside the map.
          </span>
        </li>
      </ul>
    </section>
  );
}

/**
 * The coordinator's neighbour check over a season map: a toggle, a mark on each plot with
 * findings, the panel with one plot's findings, and the legend. Hand `overlay` to the map.
 */
export function useNeighbourCheckOverlay({ siteId, seasonId, seasonYear, plotBookHref }: NeighbourCheckOptions) {
  const [on, setOn] = useState(false);
  const [chosen, setChosen] = useState<{ siteId: number; plotId: number } | null>(null);
  const panelId = useId();
  const findings = useSiteFindings(siteId, seasonId ?? null, on);
  const chosenId = chosen?.siteId === siteId ? chosen.plotId : null;

  const byPlot = useMemo(() => {
    const map = new Map<number, SiteFinding[]>();
    for (const f of findings.data?.items ?? []) map.set(f.plotId, [...(map.get(f.plotId) ?? []), f]);
    for (const list of map.values()) list.sort((a, b) => severityOrder.indexOf(a.severity) - severityOrder.indexOf(b.severity));
    return map;
  }, [findings.data]);

  const shownYear = findings.data?.seasonYear ?? seasonYear;
  const choose = (plotId: number) => setChosen({ siteId, plotId });

  const controls = (
    <div className="flex flex-wrap items-center gap-3">
      <Button variant="secondary" aria-pressed={on} disabled={seasonId == null} onClick={() => setOn((v) => !v)}>
        <ScanSearch className="size-5" aria-hidden="true" />
        Show neighbour check
        <span className={`rounded-full px-2 text-sm ${on ? 'bg-leaf text-white' : 'bg-paper-200'}`} aria-hidden="true">
          {on ? 'on' : 'off'}
        </span>
      </Button>
      <p className="text-sm text-stone" role="status">
        {seasonId === null
          ? 'The neighbour check reads a season’s plantings: open a season first.'
          : !on
            ? ''
            : findings.isPending
              ? 'Checking the plantings…'
              : findings.isError
                ? ''
                : summary(findings.data.items, byPlot.size, shownYear)}
      </p>
    </div>
  );

  const marks = ({ plots, scale, width }: OverlayView) =>
    on && findings.data
      ? plots.flatMap(({ plot, rect }) => {
          const list = byPlot.get(plot.id);
          if (!list) return [];
          const counts = countBySeverity(list);
          const fp = footprint(rect);
          const isChosen = chosenId === plot.id;
          const present = severityOrder.filter((s) => counts[s] > 0);
          // Each count takes about 28 px; on a plot drawn narrower than that, the worst severity and the total stand for them.
          const roomy = (fp.maxX - fp.minX) * scale - 4 >= 8 + 28 * present.length;
          return [
            <button
              key={`finding-mark-${plot.id}`}
              type="button"
              aria-pressed={isChosen}
              aria-controls={panelId}
              data-finding-mark={plot.label}
              onClick={() => {
                choose(plot.id);
                // On a phone the panel sits below the map: bring it into view (a no-op when it is already in view).
                requestAnimationFrame(() => document.getElementById(panelId)?.scrollIntoView({ block: 'nearest' }));
              }}
              onFocus={() => choose(plot.id)}
              className={`absolute z-[25] inline-flex h-7 items-center gap-1 rounded-full border-2 bg-white px-1.5 text-xs font-bold text-soil shadow ${
                isChosen ? 'border-soil ring-2 ring-soil ring-offset-1' : 'border-soil/60'
              }`}
              // Inside the plot's north-east corner, so it never runs off the map's edge or over the resize grip (south-east).
              style={{ right: width - fp.maxX * scale + 2, top: fp.minY * scale + 2 }}
            >
              {/* The name comes from the content, so the visible counts are part of it: "Neighbour check for plot A-1: 2 clashes, 1 to watch". */}
              <span className="sr-only">Neighbour check for plot {plot.label}: </span>
              {roomy ? (
                present.map((s, i) => (
                  <span key={s} className="inline-flex items-center gap-0.5 tabular-nums">
                    <SeveritySymbol severity={s} className="size-3.5" />
                    {counts[s]}
                    <span className="sr-only">
                      {severityCount(s, counts[s]).slice(String(counts[s]).length)}
                      {i < present.length - 1 ? ', ' : ''}
                    </span>
                  </span>
                ))
              ) : (
                <span className="inline-flex items-center gap-0.5 tabular-nums">
                  <SeveritySymbol severity={present[0]} className="size-3.5" />
                  {list.length}
                  <span className="sr-only"> findings: {countsSentence(counts)}</span>
                </span>
              )}
            </button>,
          ];
        })
      : null;

  let panel: ReactNode = null;
  if (on) {
    const chosenList = chosenId !== null ? (byPlot.get(chosenId) ?? []) : [];
    const label = chosenList[0]?.plotLabel;
    panel = (
      <Card className="space-y-3 p-4" id={panelId} role="region" aria-live="polite" aria-label="Neighbour check findings">
        {findings.isPending ? (
          <LoadingState label="Checking the plantings…" />
        ) : findings.isError ? (
          <div role="alert" className="space-y-2">
            <h2 className="text-lg font-semibold">The neighbour check could not be loaded</h2>
            <p className="text-stone">
              {isApiError(findings.error, 403) ? 'Only the club’s coordinators see the neighbour check of a whole site.' : findings.error.message}
            </p>
            <Button variant="secondary" onClick={() => void findings.refetch()} loading={findings.isFetching} loadingText="Trying again…">
              Try again
            </Button>
          </div>
        ) : chosenId !== null && chosenList.length > 0 ? (
          <>
            <div className="flex items-start justify-between gap-2">
              <h2 className="text-lg font-semibold">
                Plot {label}: {countsSentence(countBySeverity(chosenList))}
              </h2>
              <Button variant="ghost" className="px-2" aria-label="Close the plot's findings" onClick={() => setChosen(null)}>
                <X className="size-5" aria-hidden="true" />
              </Button>
            </div>
            {plotBookHref && <Link to={plotBookHref(chosenId)}>Plot book of {label}</Link>}
            <ul className="space-y-2">
              {chosenList.map((f) => (
                <FindingCard key={f.key} finding={f} />
              ))}
            </ul>
          </>
        ) : (
          <>
            <h2 className="text-lg font-semibold">Neighbour check{shownYear ? `, ${shownYear}` : ''}</h2>
            <p className="text-stone">
              {findings.data.items.length === 0
                ? 'Nothing was found on this site’s plantings: no clashes, nothing to watch and no good pairings noted.'
                : 'Select a mark on a plot, or Tab to it, to read what was found there.'}
            </p>
          </>
        )}
      </Card>
    );
  }

  return { overlay: { controls, marks, panel, legend: on ? <NeighbourCheckLegend /> : null } };
}
