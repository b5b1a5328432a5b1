import { useState, type ReactNode } from 'react';
import { localToday } from '@shared/dates';
import type { PlotPart } from '@shared/schemas/plot-book';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Spinner } from '@/components/ui/spinner';
import { useTimeZone } from '@/lib/time-zone';
import { useWhatFits } from '../api/get-what-fits';
import { errorText, findingCounts, verdictWords } from '../lib/wording';
import { FindingList } from './finding-list';
import { FindingMark } from './finding-mark';

/** How many crops are listed before "Show all". */
const FIRST_SHOWN = 10;
const CALENDAR_DATE = /^\d{4}-\d{2}-\d{2}$/;

export interface WhatFitsProps {
  plotId: number;
  /** Changes whenever the plot's plantings change, so the list is asked again after a save. */
  plantingsStamp: string;
  /** Draws the plot's part picker (whole plot or a part); left out, the whole plot is asked about. */
  renderPartPicker?: (value: PlotPart | null, onChange: (part: PlotPart | null) => void) => ReactNode;
  showKeptReasons: boolean;
}

/** "What fits here": the club's crops ranked for this plot (or a part of it) on a day, good choices first, each with its reasons. */
export function WhatFits({ plotId, plantingsStamp, renderPartPicker, showKeptReasons }: WhatFitsProps) {
  const zone = useTimeZone();
  const [date, setDate] = useState(() => localToday(zone));
  const [part, setPart] = useState<PlotPart | null>(null);
  const [showAll, setShowAll] = useState(false);
  const dateOk = CALENDAR_DATE.test(date);
  const fits = useWhatFits(plotId, dateOk ? { date, part, plantingsStamp } : null);
  const items = fits.data?.items ?? [];
  const shown = showAll ? items : items.slice(0, FIRST_SHOWN);

  return (
    <div className="flex min-w-0 flex-col gap-4">
      <TextField
        label="Sowing or planting-out date"
        type="date"
        className="max-w-xs"
        value={date}
        onChange={(e) => setDate(e.target.value)}
        error={dateOk ? undefined : 'Choose the date'}
      />
      {renderPartPicker?.(part, setPart)}
      <div role="status" className="min-h-6 text-sm">
        {!dateOk ? null : fits.checking ? (
          <span className="flex items-center gap-2 text-stone">
            <Spinner className="size-4" /> Weighing the club's crops for {part ? 'this part' : 'this plot'}…
          </span>
        ) : fits.isError ? (
          <span className="font-medium text-clay-700">{errorText(fits.error)}</span>
        ) : fits.data ? (
          <span>{items.length === 0 ? 'No crops came back for this date.' : `${items.length} crops, best first.`}</span>
        ) : null}
      </div>
      {dateOk && items.length > 0 && (
        <ol aria-label={`Crops ranked for ${part ? 'this part of the plot' : 'this plot'}`} aria-busy={fits.checking} className="flex flex-col gap-3">
          {shown.map((item) => {
            const counts = findingCounts(item.findings);
            return (
              <li key={item.crop.id} className="min-w-0 rounded-lg border border-paper-200 bg-white p-3 sm:p-4">
                <div className="flex flex-wrap items-baseline justify-between gap-x-3">
                  <h3 className="font-semibold break-words">{item.crop.commonName}</h3>
                  <span className="text-sm text-stone">{item.crop.family}</span>
                </div>
                <p className="mt-1 flex items-center gap-2 text-sm font-semibold">
                  <FindingMark kind={item.verdict} />
                  {verdictWords[item.verdict]}
                </p>
                {item.findings.length === 0 ? (
                  <p className="mt-1 text-sm text-stone">Nothing found against it or for it.</p>
                ) : (
                  <details className="mt-1">
                    <summary className="flex min-h-11 cursor-pointer items-center text-sm font-medium">Why: {counts}</summary>
                    <div className="pt-2">
                      <FindingList findings={item.findings} label={`Reasons for ${item.crop.commonName}`} headingLevel={4} showKeptReasons={showKeptReasons} />
                    </div>
                  </details>
                )}
              </li>
            );
          })}
        </ol>
      )}
      {dateOk && items.length > FIRST_SHOWN && (
        <Button variant="secondary" className="self-start" onClick={() => setShowAll((v) => !v)}>
          {showAll ? `Show the first ${FIRST_SHOWN}` : `Show all ${items.length} crops`}
        </Button>
      )}
    </div>
  );
}
