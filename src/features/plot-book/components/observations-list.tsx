import type { Observation, Planting } from '@shared/schemas/plot-book';
import { Badge } from '@/components/ui/badge';
import { calendarDate, plantingName } from '../lib/format';

const severityBadge = { light: 'Light', moderate: 'Moderate', severe: 'Severe' } as const;

/** The plot's pests and diseases, newest first, with photos; soil-borne ones are marked as kept against the soil. */
export function ObservationsList({ observations, plantings }: { observations: Observation[]; plantings: Planting[] }) {
  if (observations.length === 0) return <p className="text-stone">Nothing recorded on this plot yet.</p>;
  return (
    <ul className="flex flex-col gap-4">
      {observations.map((o) => {
        const planting = plantings.find((p) => p.id === o.plantingId);
        return (
          <li key={o.id} className="rounded-lg border border-paper-200 bg-white p-4">
            <div className="flex flex-wrap items-center gap-2">
              <h3 className="font-semibold">{o.name}</h3>
              <Badge tone={o.severity === 'severe' ? 'straw' : 'neutral'}>{severityBadge[o.severity]}</Badge>
              {o.isSoilBorne && <Badge tone="straw">Stays in the soil</Badge>}
            </div>
            <p className="text-sm text-stone">
              {calendarDate(o.observedOn)}
              {planting ? ` · on ${plantingName(planting)}` : ''}
            </p>
            {o.notes && <p className="mt-1 whitespace-pre-line">{o.notes}</p>}
            {o.photos.length > 0 && (
              <ul className="mt-3 flex flex-wrap gap-2" aria-label={`Photos of ${o.name}`}>
                {o.photos.map((ph, i) => (
                  <li key={ph.id}>
                    <a href={ph.url} target="_blank" rel="noreferrer" className="block">
                      <img src={ph.thumbUrl} alt={`${o.name}, photo ${i + 1} of ${o.photos.length}`} width={96} height={96} className="size-24 rounded-md object-cover" />
                    </a>
                  </li>
                ))}
              </ul>
            )}
          </li>
        );
      })}
    </ul>
  );
}
