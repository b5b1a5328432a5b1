import { useId, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { formatMoney } from '@shared/fees/compute';
import { formatWeight } from '@shared/plot-book';
import type { findingKinds } from '@shared/schemas/findings';
import type { SeasonSummary, SiteSummary, WeekCoverage } from '@shared/schemas/season-summary';
import { Alert } from '@/components/ui/alert';
import { LoadingState } from '@/components/ui/spinner';
import { plural } from '@/lib/format';
import { paths } from '@/lib/paths';
import { useSeasonSummary } from '../api/get-season-summary';
import { palette } from '@/lib/palette';

// The coordinator's season in pictures. Every picture is a plain SVG of bars drawn in percentages (so
// it fits any width), named by its <title>; the same numbers are always written out beside it, and
// the kinds of part differ by pattern as well as colour (solid, hatched, dotted, empty), each in a
// legend with its count. Loaded lazily from the home page, so holders and volunteers never fetch it.

type Fill = 'solid' | 'hatch' | 'dots' | 'empty';

interface Part {
  value: number;
  fill: Fill;
}

/** The patterns a bar may use, under ids unique to this bar. */
function Patterns({ prefix }: { prefix: string }) {
  return (
    <defs>
      <pattern id={`${prefix}-hatch`} width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
        <rect width="6" height="6" fill={palette.water[50]} />
        <rect width="3" height="6" fill={palette.water.DEFAULT} />
      </pattern>
      <pattern id={`${prefix}-dots`} width="6" height="6" patternUnits="userSpaceOnUse">
        <rect width="6" height="6" fill={palette.clay[50]} />
        <circle cx="3" cy="3" r="1.6" fill={palette.clay[700]} />
      </pattern>
    </defs>
  );
}

function fillOf(fill: Fill, prefix: string): string {
  if (fill === 'solid') return palette.leaf.DEFAULT;
  if (fill === 'empty') return palette.white;
  return `url(#${prefix}-${fill})`;
}

function usePrefix(): string {
  return `g${useId().replace(/[^a-zA-Z0-9]/g, '')}`;
}

/** One bar of parts out of `total` (the parts may add up to less), named by `label`. */
function Bar({ parts, total, label, height = 16 }: { parts: Part[]; total: number; label: string; height?: number }) {
  const prefix = usePrefix();
  let x = 0;
  return (
    <svg role="img" aria-labelledby={`${prefix}-title`} width="100%" height={height} className="block rounded-sm border border-stone">
      <title id={`${prefix}-title`}>{label}</title>
      <Patterns prefix={prefix} />
      <rect x="0" y="0" width="100%" height={height} fill={palette.white} />
      {total > 0 &&
        parts.map((part, i) => {
          if (part.value <= 0) return null;
          const width = (Math.min(part.value, total - x) / total) * 100;
          const rect = <rect key={i} x={`${(x / total) * 100}%`} y="0" width={`${width}%`} height={height} fill={fillOf(part.fill, prefix)} />;
          x += part.value;
          return rect;
        })}
      {/* Thin white gaps between parts (the outline is the border), so neighbouring parts stay apart without colour. */}
      {total > 0 &&
        parts.slice(0, -1).reduce<{ at: number; lines: ReactNode[] }>(
          (acc, part, i) => {
            const at = acc.at + Math.max(0, part.value);
            if (part.value > 0 && at < total) acc.lines.push(<rect key={i} x={`${(at / total) * 100}%`} y="0" width="2" height={height} fill={palette.white} />);
            return { at, lines: acc.lines };
          },
          { at: 0, lines: [] },
        ).lines}
    </svg>
  );
}

/** A legend swatch: the pattern of a part, drawn small. */
function Swatch({ fill }: { fill: Fill }) {
  const prefix = usePrefix();
  return (
    <svg aria-hidden="true" width="14" height="14" className="inline-block shrink-0 align-[-2px]">
      <Patterns prefix={prefix} />
      <rect x="0.5" y="0.5" width="13" height="13" rx="2" fill={fillOf(fill, prefix)} stroke={palette.stone.DEFAULT} />
    </svg>
  );
}

function GlanceCard({ title, href, linkText, children }: { title: string; href: string; linkText: string; children: ReactNode }) {
  return (
    <li className="flex min-w-0 flex-col rounded-xl border border-leaf-100 bg-white p-5 shadow-sm">
      <h3 className="text-lg font-semibold">
        {title}
      </h3>
      <div className="mt-3 flex-1 space-y-3">{children}</div>
      <Link to={href} className="mt-4 inline-flex min-h-11 items-center self-start font-semibold text-water underline-offset-2 hover:underline">
        {linkText}
      </Link>
    </li>
  );
}

const plotParts: Array<{ key: keyof Pick<SiteSummary, 'taken' | 'offered' | 'renewalPending' | 'free'>; label: string; fill: Fill }> = [
  { key: 'taken', label: 'Taken', fill: 'solid' },
  { key: 'offered', label: 'Offered', fill: 'hatch' },
  { key: 'renewalPending', label: 'Renewal pending', fill: 'dots' },
  { key: 'free', label: 'Free', fill: 'empty' },
];

function PlotsCard({ clubId, summary }: { clubId: number; summary: SeasonSummary }) {
  return (
    <GlanceCard title={`Plots in ${summary.season!.year}`} href={paths.springRound(clubId)} linkText="Open the spring round">
      {summary.sites.map((site) => {
        const total = site.taken + site.offered + site.renewalPending + site.free;
        const words = plotParts.map((p) => `${site[p.key]} ${p.label.toLowerCase()}`).join(', ');
        return (
          <div key={site.siteId} className="space-y-1" data-testid={`glance-site-${site.siteId}`}>
            <p className="flex flex-wrap items-baseline justify-between gap-x-2">
              <Link to={paths.map(clubId, site.siteId)} className="inline-flex min-h-11 items-center font-semibold text-water underline-offset-2 hover:underline">
                {site.name}
              </Link>
              <span className="text-sm text-stone">{plural(total, 'plot')}</span>
            </p>
            <Bar label={`${site.name}: ${words}, of ${plural(total, 'plot')}`} total={total} parts={plotParts.map((p) => ({ value: site[p.key], fill: p.fill }))} />
            <ul className="flex flex-wrap gap-x-3 gap-y-1 text-sm" aria-label={`${site.name} plots by state`}>
              {plotParts.map((p) => (
                <li key={p.key} className="flex items-center gap-1">
                  <Swatch fill={p.fill} />
                  <span>
                    {p.label} <strong data-testid={`glance-site-${site.siteId}-${p.key}`}>{site[p.key]}</strong>
                  </span>
                </li>
              ))}
            </ul>
          </div>
        );
      })}
    </GlanceCard>
  );
}

function FeesCard({ clubId, summary }: { clubId: number; summary: SeasonSummary }) {
  const { dueMinor, paidMinor, refundedMinor, currency, count } = summary.fees;
  const money = (minor: number) => formatMoney(minor, currency);
  const percent = dueMinor > 0 ? Math.round((Math.min(paidMinor, dueMinor) / dueMinor) * 100) : 0;
  return (
    <GlanceCard title={`Fees for ${summary.season!.year}`} href={paths.fees(clubId, summary.season!.year)} linkText="Open the fees">
      {count === 0 ? (
        <p className="text-stone">No fees charged for {summary.season!.year} yet.</p>
      ) : (
        <>
          <p data-testid="glance-fees">
            <strong>{money(paidMinor)}</strong> collected of <strong>{money(dueMinor)}</strong> due ({percent} %)
          </p>
          <Bar
            height={20}
            label={`Fees: ${money(paidMinor)} collected of ${money(dueMinor)} due, ${percent} %`}
            total={dueMinor}
            parts={[{ value: paidMinor, fill: 'solid' }]}
          />
          <ul className="flex flex-wrap gap-x-3 gap-y-1 text-sm" aria-label="Fees key">
            <li className="flex items-center gap-1">
              <Swatch fill="solid" /> Collected
            </li>
            <li className="flex items-center gap-1">
              <Swatch fill="empty" /> Still to come {money(Math.max(0, dueMinor - paidMinor))}
            </li>
          </ul>
          <p className="text-sm text-stone">
            {plural(count, 'fee')}
            {refundedMinor > 0 && `; ${money(refundedMinor)} of deposits handed back`}
          </p>
        </>
      )}
    </GlanceCard>
  );
}

const dayMonth = (iso: string) => new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' }).format(new Date(`${iso}T00:00:00Z`));

function weekName(week: WeekCoverage, index: number): string {
  return index === 0 ? `This week (${dayMonth(week.weekStart)})` : `Week of ${dayMonth(week.weekStart)}`;
}

function ShiftsCard({ clubId, summary }: { clubId: number; summary: SeasonSummary }) {
  return (
    <GlanceCard title="Shift places, next 4 weeks" href={paths.shifts(clubId)} linkText="Open the shift board">
      <ul className="space-y-3">
        {summary.shiftWeeks.map((week, i) => {
          const words = week.places === 0 ? 'no shifts' : `${week.taken} of ${week.places} places taken`;
          return (
            <li key={week.weekStart} className="space-y-1" data-testid={`glance-week-${week.weekStart}`}>
              <p className="flex flex-wrap items-baseline justify-between gap-x-2">
                <Link to={paths.shifts(clubId, `?date=${week.weekStart}`)} className="inline-flex min-h-11 items-center font-semibold text-water underline-offset-2 hover:underline">
                  {weekName(week, i)}
                </Link>
                <span className="text-sm">{week.places === 0 ? 'No shifts' : `${week.taken} of ${week.places} places`}</span>
              </p>
              {week.places > 0 && (
                <Bar label={`${weekName(week, i)}: ${words}`} total={week.places} height={12} parts={[{ value: week.taken, fill: 'solid' }]} />
              )}
            </li>
          );
        })}
      </ul>
      <p className="flex items-center gap-1 text-sm">
        <Swatch fill="solid" /> Taken <Swatch fill="empty" /> Still open
      </p>
    </GlanceCard>
  );
}

const kindLabels: Record<(typeof findingKinds)[number], string> = {
  rotation: 'Rotation',
  companion: 'Neighbours',
  shade: 'Shade',
  site_fit: 'Fit for the place',
};

function FindingsCard({ clubId, summary }: { clubId: number; summary: SeasonSummary }) {
  const most = Math.max(1, ...summary.findings.map((f) => f.count));
  const total = summary.findings.reduce((s, f) => s + f.count, 0);
  return (
    <GlanceCard title={`Neighbour check, ${summary.findingsSeasonYear}`} href={paths.findings(clubId)} linkText="Open the findings">
      <p className="text-sm text-stone">{plural(total, 'finding')} this season, by kind</p>
      <ul className="space-y-2">
        {summary.findings.map((f) => (
          <li key={f.kind} className="grid grid-cols-[minmax(0,8rem)_1fr_auto] items-center gap-2" data-testid={`glance-finding-${f.kind}`}>
            <Link to={`${paths.findings(clubId)}?kind=${f.kind}`} className="inline-block min-h-11 truncate py-2.5 text-water underline-offset-2 hover:underline">
              {kindLabels[f.kind]}
            </Link>
            <Bar label={`${kindLabels[f.kind]}: ${plural(f.count, 'finding')}`} total={most} height={12} parts={[{ value: f.count, fill: 'hatch' }]} />
            <strong className="tabular-nums">{f.count}</strong>
          </li>
        ))}
      </ul>
    </GlanceCard>
  );
}

function HarvestCard({ clubId, summary }: { clubId: number; summary: SeasonSummary }) {
  const { grams, count, plantings, seasonYear, units } = summary.harvest;
  return (
    <GlanceCard title={`Harvest so far, ${seasonYear}`} href={paths.harvests(clubId)} linkText="Open the harvest figures">
      {grams === 0 && count === 0 ? (
        <p className="text-stone">Nothing weighed or counted yet this season.</p>
      ) : (
        <p data-testid="glance-harvest">
          <strong className="text-2xl">{formatWeight(grams, units)}</strong>
          {count > 0 && <> and {plural(count, 'item')} counted</>}
        </p>
      )}
      <p className="text-sm text-stone">From {plural(plantings, 'planting')} in the ground this season.</p>
    </GlanceCard>
  );
}

export interface SeasonGlanceProps {
  clubId: number;
}

/** The season at a glance: a card per picture, each linking to its page; only cards whose feature has something to show. */
export function SeasonGlance({ clubId }: SeasonGlanceProps) {
  const summary = useSeasonSummary(clubId);
  if (summary.isPending) {
    return (
      <div className="mb-4">
        <LoadingState inline label="Loading the season at a glance…" />
      </div>
    );
  }
  if (summary.isError) return <Alert tone="error">The season at a glance didn't load. {summary.error.message}</Alert>;
  const s = summary.data;
  return (
    <ul className="mb-4 grid gap-4 sm:grid-cols-2 lg:grid-cols-3" aria-label="Season at a glance">
      {s.season && s.sites.length > 0 && <PlotsCard clubId={clubId} summary={s} />}
      {s.season && <FeesCard clubId={clubId} summary={s} />}
      <ShiftsCard clubId={clubId} summary={s} />
      {s.findingsSeasonYear !== null && <FindingsCard clubId={clubId} summary={s} />}
      {s.harvest.seasonYear !== null && <HarvestCard clubId={clubId} summary={s} />}
    </ul>
  );
}
