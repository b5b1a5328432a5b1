import type { FindingView } from '@shared/schemas/findings';
import { findingCounts, groupByPlanting } from '../lib/wording';
import { FindingList } from './finding-list';

export interface NeighbourCheckProps {
  findings: readonly FindingView[];
  /** The season's plantings in the plot book's order, with their names as the book says them. */
  plantings: readonly { id: number; name: string }[];
  showKeptReasons: boolean;
}

/** The plot book's "Neighbour check": the season's findings, one group per planting. */
export function NeighbourCheck({ findings, plantings, showKeptReasons }: NeighbourCheckProps) {
  if (plantings.length === 0) return <p className="text-stone">Nothing planted to check yet.</p>;
  const groups = groupByPlanting(findings, plantings);
  if (groups.length === 0) return <p className="text-stone">Nothing found for this season's plantings.</p>;
  const quiet = plantings.filter((p) => !groups.some((g) => g.plantingId === p.id));
  return (
    <div className="flex min-w-0 flex-col gap-6">
      <p>Found {findingCounts(findings)}.</p>
      {groups.map((g) => (
        <section key={g.plantingId} aria-labelledby={`check-${g.plantingId}`} className="flex min-w-0 flex-col gap-3">
          <h3 id={`check-${g.plantingId}`} className="text-lg font-semibold break-words">
            {g.name}
          </h3>
          <FindingList findings={g.findings} label={`Findings for ${g.name}`} headingLevel={4} showKeptReasons={showKeptReasons} />
        </section>
      ))}
      {quiet.length > 0 && (
        <p className="text-sm text-stone break-words">Nothing found for {quiet.map((p) => p.name).join(', ')}.</p>
      )}
    </div>
  );
}
