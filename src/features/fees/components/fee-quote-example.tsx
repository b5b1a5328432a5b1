import { computePlotFee, formatMoney } from '@shared/fees/compute';
import { feetToMetres } from '@shared/geometry';
import type { FeeSchedule } from '@shared/schemas/fees';
import { plotKindLabels, plotKinds, type PlotKind } from '@shared/schemas/plots';
import { moneyFields, type ScheduleFormValues } from '../lib/schedule-form';
import { moneyOrNull } from '../lib/money-form';

// The usual community-garden plot sizes, as in the demo sites: 3 × 6 m, or 10 × 20 ft where feet are used.
const examplePlots = {
  m2: { text: 'A 3 × 6 m plot (18 m²)', areaM2: 18 },
  ft2: { text: 'A 10 × 20 ft plot (200 ft²)', areaM2: feetToMetres(10) * feetToMetres(20) },
} as const;

function readSchedule(values: Partial<ScheduleFormValues>): FeeSchedule | null {
  const money: Partial<Record<(typeof moneyFields)[number], number>> = {};
  for (const field of moneyFields) {
    const minor = moneyOrNull(values[field]);
    if (minor === null) return null;
    money[field] = minor;
  }
  const percent = /^\d+$/.test(values.concessionPercent?.trim() ?? '') ? Number(values.concessionPercent) : NaN;
  if (!(percent >= 0 && percent <= 100)) return null;
  return {
    basis: values.basis ?? 'kind',
    areaUnit: values.areaUnit ?? 'm2',
    concessionPercent: percent,
    ...(money as Record<(typeof moneyFields)[number], number>),
  };
}

function line(schedule: FeeSchedule, label: string, plot: { areaM2: number; kind: PlotKind }, currency: string) {
  const full = computePlotFee(schedule, plot, { concession: false });
  const reduced = computePlotFee(schedule, plot, { concession: true });
  const parts = [`${label}: ${formatMoney(full.plotFeeMinor, currency)}`];
  if (schedule.concessionPercent > 0) parts.push(`concession ${formatMoney(reduced.plotFeeMinor, currency)}`);
  if (schedule.depositMinor > 0) parts.push(`deposit ${formatMoney(schedule.depositMinor, currency)}`);
  return parts.join(', ');
}

/**
 * What the schedule being typed would charge, worked out in the browser for display only: the
 * server computes each real fee from the saved schedule.
 */
export function FeeQuoteExample({ values, currency }: { values: Partial<ScheduleFormValues>; currency: string }) {
  const schedule = readSchedule(values);
  const lines = !schedule
    ? []
    : schedule.basis === 'area'
      ? [line(schedule, examplePlots[schedule.areaUnit].text, { areaM2: examplePlots[schedule.areaUnit].areaM2, kind: 'in_ground' }, currency)]
      : plotKinds.map((kind) => line(schedule, plotKindLabels[kind], { areaM2: 1, kind }, currency));
  return (
    <div className="rounded-lg border border-paper-200 bg-paper-100 p-4" aria-live="polite">
      <p className="font-semibold">What this charges</p>
      {schedule ? (
        <ul className="mt-1 flex flex-col gap-1">
          {lines.map((l) => (
            <li key={l}>{l}</li>
          ))}
        </ul>
      ) : (
        <p className="mt-1 text-stone">Fix the amounts above to see an example.</p>
      )}
    </div>
  );
}
