import { useState } from 'react';
import { AlertTriangle, CalendarDays, Scale, Sprout } from 'lucide-react';
import { formatWeight } from '@shared/plot-book/harvest';
import type { UnitSystem } from '@shared/geometry';
import { plantingStatuses, type Harvest, type Planting } from '@shared/schemas/plot-book';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Select } from '@/components/ui/select';
import { plural } from '@/lib/format';
import { useUpdatePlanting } from '../api/update-planting';
import { areaText, calendarDate, dateSpan, partText, plantingName, statusWords } from '../lib/format';
import { HarvestForm } from './harvest-form';

// Spacings come from inches (2 in = 5.08 cm); nobody sows to the tenth of a millimetre.
const cm = (v: number) => `${v >= 10 ? Math.round(v) : Math.round(v * 2) / 2} cm`;

export interface PlantingCardProps {
  planting: Planting;
  harvests: Harvest[];
  plotId: number;
  units: UnitSystem;
  canWrite: boolean;
}

/** One planting with what the crop notes work out for it: plants that fit, the dates to watch, its harvests. */
export function PlantingCard({ planting: p, harvests, plotId, units, canWrite }: PlantingCardProps) {
  const [logging, setLogging] = useState(false);
  const update = useUpdatePlanting(plotId);
  const c = p.computed;
  const mine = harvests.filter((h) => h.plantingId === p.id);
  const grams = mine.reduce((sum, h) => sum + (h.grams ?? 0), 0);
  const pieces = mine.reduce((sum, h) => sum + (h.count ?? 0), 0);
  return (
    <Card className="flex flex-col gap-4" role="article" aria-labelledby={`planting-${p.id}`}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h3 id={`planting-${p.id}`} className="text-lg font-semibold">
            {plantingName(p)}
          </h3>
          <p className="text-sm text-stone">
            {p.crop.family} · {partText(p.part, units)} ({areaText(c.areaM2, units)})
          </p>
        </div>
        <Badge tone={p.status === 'failed' ? 'neutral' : p.status === 'finished' ? 'neutral' : 'leaf'}>{statusWords[p.status]}</Badge>
      </div>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2">
        <dt className="flex items-center gap-1.5 text-stone">
          <Sprout className="size-4" aria-hidden="true" /> {p.method === 'sown' ? 'Sown' : 'Planted out'}
        </dt>
        <dd>{calendarDate(p.plantedOn)}</dd>
        <dt className="text-stone">Plants that fit</dt>
        <dd>
          {c.plantsThatFit
            ? `${c.plantsThatFit.plants} (${plural(c.plantsThatFit.rows, 'row')} of ${c.plantsThatFit.perRow}, ${cm(c.plantsThatFit.inRowCm)} apart${c.plantsThatFit.betweenRowCm ? `, rows ${cm(c.plantsThatFit.betweenRowCm)} apart` : ''})`
            : 'The crop notes give no spacing'}
        </dd>
        {c.emergence && (
          <>
            <dt className="text-stone">Comes up</dt>
            <dd>
              about {calendarDate(c.emergence.expected)}
              <span className="block text-sm text-stone">
                {dateSpan(c.emergence.earliest, c.emergence.latest)}
                {c.emergence.basis === 'table' && c.soilTempC !== null ? `, for soil at ${c.soilTempC} °C` : ', from the crop notes’ range'}
              </span>
            </dd>
          </>
        )}
        {c.thinning && (
          <>
            <dt className="text-stone">Thin</dt>
            <dd>from {calendarDate(c.thinning)}, to the spacing above</dd>
          </>
        )}
        {c.sideDressing && (
          <>
            <dt className="text-stone">Feed (side-dress)</dt>
            <dd>{dateSpan(c.sideDressing.earliest, c.sideDressing.latest)}</dd>
          </>
        )}
        {c.harvestWindow && (
          <>
            <dt className="flex items-center gap-1.5 text-stone">
              <CalendarDays className="size-4" aria-hidden="true" /> Harvest
            </dt>
            <dd>
              {dateSpan(c.harvestWindow.earliest, c.harvestWindow.latest)}
              <span className="block text-sm text-stone">
                counted from {c.harvestWindow.countedFrom}
                {c.harvestWindow.allowanceDays ? `, with ${Math.abs(c.harvestWindow.allowanceDays)} days allowed for ${c.harvestWindow.allowanceDays > 0 ? 'raising the seedling' : 'the head start of a transplant'}` : ''}
              </span>
            </dd>
          </>
        )}
        <dt className="flex items-center gap-1.5 text-stone">
          <Scale className="size-4" aria-hidden="true" /> Picked
        </dt>
        <dd>
          {mine.length === 0
            ? 'Nothing logged yet'
            : [grams > 0 ? formatWeight(grams, units) : null, pieces > 0 ? plural(pieces, 'piece') : null].filter(Boolean).join(' and ') +
              ` in ${plural(mine.length, 'picking')}`}
        </dd>
      </dl>
      {c.warnings.map((w) => (
        <Alert key={w.kind} tone="warning" announce={false}>
          <span className="flex items-start gap-2">
            <AlertTriangle className="mt-0.5 size-4 shrink-0" aria-hidden="true" />
            {w.message}
          </span>
        </Alert>
      ))}
      {c.sideDressing && (
        <p className="text-sm text-stone">
          Feeding: follow the fertiliser’s label for the amount, wear gloves, and water it in; your club or local rules may limit what can be used.
        </p>
      )}
      {p.notes && <p className="whitespace-pre-line">{p.notes}</p>}
      {canWrite && (
        <div className="flex flex-col gap-3">
          {logging ? (
            <HarvestForm plotId={plotId} plantingId={p.id} units={units} onDone={() => setLogging(false)} />
          ) : (
            <div className="flex flex-wrap items-end gap-3">
              <Button variant="secondary" onClick={() => setLogging(true)} aria-label={`Log a harvest of ${plantingName(p)}`}>
                Log a harvest
              </Button>
              <Select
                label={`Status of ${plantingName(p)}`}
                hideLabel
                value={p.status}
                disabled={update.isPending}
                onChange={(e) => update.mutate({ plantingId: p.id, body: { version: p.version, status: e.target.value as Planting['status'] } })}
                className="w-48"
              >
                {plantingStatuses.map((s) => (
                  <option key={s} value={s}>
                    {statusWords[s]}
                  </option>
                ))}
              </Select>
            </div>
          )}
          {update.isError && <Alert tone="error">{update.error.message}</Alert>}
        </div>
      )}
    </Card>
  );
}
