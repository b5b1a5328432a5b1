import type { UnitSystem } from '@shared/geometry';
import { formatWeight } from '@shared/plot-book/harvest';
import type { Planting, PlotBook } from '@shared/schemas/plot-book';
import { plantingName } from '../lib/format';
import { palette } from '@/lib/palette';

const perArea = (grams: number | null, units: UnitSystem) =>
  grams === null || grams === 0 ? '—' : units === 'us' ? `${formatWeight(grams * 0.09290304, 'us')} a ft²` : `${formatWeight(grams, 'metric')} a m²`;

/**
 * This season's harvest by planting: bars of the weight picked (SVG of our own, each labelled with its
 * figure so nothing rests on colour) and a table with totals, per area and per plant.
 */
export function HarvestFigures({ book, plantings }: { book: PlotBook; plantings: Planting[] }) {
  const units = book.plot.units;
  const rows = book.harvestTotals.byPlanting
    .map((t) => ({ t, planting: plantings.find((p) => p.id === t.plantingId) }))
    .filter((r): r is { t: (typeof r)['t']; planting: Planting } => Boolean(r.planting) && (r.t.grams > 0 || r.t.count > 0));
  if (rows.length === 0) return <p className="text-stone">No harvests logged this season yet.</p>;
  const max = Math.max(...rows.map((r) => r.t.grams), 1);
  const total = book.harvestTotals.plot;
  return (
    <div className="flex flex-col gap-5">
      <ul className="flex max-w-xl flex-col gap-2" aria-label="Weight picked by planting">
        {rows.map(({ t, planting }) => (
          <li key={t.plantingId} className="grid grid-cols-[8rem_1fr] items-center gap-3 text-sm sm:grid-cols-[11rem_1fr]">
            <span className="truncate">{plantingName(planting)}</span>
            <span className="flex items-center gap-2">
              {t.grams > 0 && (
                <svg aria-hidden="true" viewBox="0 0 100 10" preserveAspectRatio="none" className="h-4" style={{ width: `${Math.max((t.grams / max) * 70, 2)}%` }}>
                  <rect width="100" height="10" rx="2" fill={palette.leaf.DEFAULT} />
                </svg>
              )}
              <span className="shrink-0 tabular-nums">{t.grams > 0 ? formatWeight(t.grams, units) : `${t.count} picked`}</span>
            </span>
          </li>
        ))}
      </ul>
      <div className="overflow-x-auto">
        <table className="w-full text-left">
          <caption className="sr-only">Harvest this season by planting</caption>
          <thead className="text-sm text-stone">
            <tr>
              <th scope="col" className="py-2 pr-4 font-medium">Planting</th>
              <th scope="col" className="py-2 pr-4 font-medium">Weight</th>
              <th scope="col" className="py-2 pr-4 font-medium">Pieces</th>
              <th scope="col" className="py-2 pr-4 font-medium">{units === 'us' ? 'Per ft²' : 'Per m²'}</th>
              <th scope="col" className="py-2 font-medium">Per plant</th>
            </tr>
          </thead>
          <tbody>
            {rows.map(({ t, planting }) => (
              <tr key={t.plantingId} className="border-t border-paper-200">
                <th scope="row" className="py-2 pr-4 font-medium">{plantingName(planting)}</th>
                <td className="py-2 pr-4 tabular-nums">{t.grams > 0 ? formatWeight(t.grams, units) : '—'}</td>
                <td className="py-2 pr-4 tabular-nums">{t.count > 0 ? t.count : '—'}</td>
                <td className="py-2 pr-4 tabular-nums">{perArea(t.gramsPerM2, units)}</td>
                <td className="py-2 tabular-nums">{!t.gramsPerPlant ? '—' : formatWeight(t.gramsPerPlant, units)}</td>
              </tr>
            ))}
          </tbody>
          <tfoot>
            <tr className="border-t-2 border-soil font-semibold">
              <th scope="row" className="py-2 pr-4">The plot</th>
              <td className="py-2 pr-4 tabular-nums">{total.grams > 0 ? formatWeight(total.grams, units) : '—'}</td>
              <td className="py-2 pr-4 tabular-nums">{total.count > 0 ? total.count : '—'}</td>
              <td className="py-2 pr-4 tabular-nums">{perArea(total.gramsPerM2, units)}</td>
              <td className="py-2">—</td>
            </tr>
          </tfoot>
        </table>
      </div>
    </div>
  );
}
