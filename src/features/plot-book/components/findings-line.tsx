import { Link } from 'react-router-dom';
import { Sprout } from 'lucide-react';
import { plural } from '@/lib/format';
import { paths } from '@/lib/paths';
import { useFindingSeverities } from '../api/get-finding-severities';

/** "Neighbour check: 1 clash, 2 to watch" for the holder's plot this season, with a link to the plot book; nothing until it has answered. */
export function FindingsLine({ clubId, plotId }: { clubId: number; plotId: number }) {
  const book = useFindingSeverities(plotId);
  if (!book.isSuccess) return null;
  const clashes = book.data.findings.filter((f) => f.severity === 'clash').length;
  const watch = book.data.findings.filter((f) => f.severity === 'watch').length;
  const words = clashes + watch === 0 ? 'nothing to look at' : [clashes && plural(clashes, 'clash', 'clashes'), watch && `${watch} to watch`].filter(Boolean).join(', ');
  return (
    <p className="flex flex-wrap items-center gap-x-2 gap-y-1" data-testid="holder-findings">
      <Sprout className="size-5 shrink-0 text-leaf" aria-hidden="true" />
      <span>
        <span className="font-semibold">Neighbour check:</span> {words}
      </span>
      <Link to={paths.plotBook(clubId, plotId)} className="inline-flex min-h-11 items-center font-medium">
        See the findings in the plot book
      </Link>
    </p>
  );
}
