import { Accessibility, Droplet } from 'lucide-react';
import { plotSeasonStatusLabels, type PlotSeasonStatus } from '@shared/schemas/seasons';
import { statusClasses } from './season-status';

/** What the shapes and marks on the map mean; with a season, also what the fills say. */
export function MapLegend({ seasonYear }: { seasonYear?: number }) {
  const swatch = 'inline-block h-5 w-7 bg-white';
  return (
    <ul className="flex flex-wrap gap-x-5 gap-y-2 text-sm text-stone" aria-label="Map legend">
      {seasonYear !== undefined &&
        (Object.keys(statusClasses) as PlotSeasonStatus[]).map((s) => (
          <li key={s} className="flex items-center gap-2">
            <span className={`inline-block h-5 w-7 rounded-sm border-2 border-soil/70 ${statusClasses[s]}`} />
            {plotSeasonStatusLabels[s]} in {seasonYear}
            {s === 'taken' ? ' (holder’s initials)' : ''}
          </li>
        ))}
      <li className="flex items-center gap-2"><span className={`${swatch} rounded-sm border-2 border-soil/70`} />In-ground plot</li>
      <li className="flex items-center gap-2"><span className={`${swatch} rounded-md border-[5px] border-double border-soil/80`} />Raised bed</li>
      <li className="flex items-center gap-2"><span className={`${swatch} rounded-2xl border-2 border-dashed border-soil/80`} />Container</li>
      <li className="flex items-center gap-2"><span className={`${swatch} plot-hatch rounded-sm border-2 border-soil/70`} />Shared bed</li>
      <li className="flex items-center gap-2"><span className={`${swatch} ring-4 ring-leaf`} />Selected</li>
      <li className="flex items-center gap-2"><span className={`${swatch} outline-3 outline-dashed outline-water`} />Neighbour of the selected plot</li>
      <li className="flex items-center gap-2"><Accessibility className="size-4 text-water-700" aria-hidden="true" />Wheelchair height</li>
      <li className="flex items-center gap-2"><Droplet className="size-4 text-water-700" aria-hidden="true" />Water tap nearby</li>
    </ul>
  );
}
