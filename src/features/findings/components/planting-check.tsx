import { useEffect } from 'react';
import { Spinner } from '@/components/ui/spinner';
import { usePlantingCheck, type PlantingCheckInput } from '../api/check-planting';
import { errorText, findingCounts, hasClash } from '../lib/wording';
import { FindingList } from './finding-list';

export interface PlantingCheckProps {
  plotId: number;
  /** The planting as the form holds it; null until a crop and a date are filled in. */
  draft: PlantingCheckInput | null;
  /** Told whenever the latest findings start or stop holding a clash. */
  onClashChange: (clash: boolean) => void;
}

/** "Before you save": the neighbour check of the planting being filled in, asked as the form settles. */
export function PlantingCheck({ plotId, draft, onClashChange }: PlantingCheckProps) {
  const check = usePlantingCheck(plotId, draft);
  const findings = check.active ? check.data?.findings : undefined;
  const clash = findings ? hasClash(findings) : false;
  useEffect(() => onClashChange(clash), [clash, onClashChange]);

  if (!check.active) {
    return <p className="text-sm text-stone">Choose a crop and a date to see how it sits with the plot's history and neighbours.</p>;
  }
  const counts = findings ? findingCounts(findings) : '';
  return (
    <section aria-labelledby="planting-check-title" className="flex min-w-0 flex-col gap-3 rounded-lg bg-paper-100 p-3 sm:p-4">
      <h4 id="planting-check-title" className="font-semibold">
        Before you save: the neighbour check
      </h4>
      <div role="status" className="min-h-6 text-sm">
        {check.checking ? (
          <span className="flex items-center gap-2 text-stone">
            <Spinner className="size-4" /> Checking this planting against the plot and its neighbours…
          </span>
        ) : check.isError ? (
          <span className="font-medium text-clay-700">Could not check it just now: {errorText(check.error)} You can still save.</span>
        ) : findings ? (
          <span>{counts ? `Found ${counts}.` : 'Nothing found for this planting.'}</span>
        ) : null}
      </div>
      {findings && findings.length > 0 && (
        <div aria-busy={check.checking}>
          <FindingList findings={findings} label="What the check found for this planting" headingLevel={5} />
        </div>
      )}
    </section>
  );
}
