import { Badge } from '@/components/ui/badge';
import type { CropSourceView } from '@shared/schemas/crops';
import { evidenceLabels } from '../lib/format';

// The two marks' titles repeat the evidence word; a shorter line says what they mean beside it.
const shortTitle = (source: CropSourceView) =>
  source.evidence === 'common_practice'
    ? 'no single published source'
    : source.evidence === 'from_memory'
      ? 'not yet confirmed in a source'
      : source.title;

export interface SourceNoteProps {
  source?: CropSourceView;
  /** The table or row the value was read from, or how it was printed. */
  note?: string;
  /** The club set its own value here. */
  overridden?: boolean;
}

/** Where a value comes from, in small text: the evidence word first, then the source's title and the note. */
export function SourceNote({ source, note, overridden }: SourceNoteProps) {
  return (
    <p className="mt-1 flex flex-wrap items-baseline gap-x-2 gap-y-1 text-sm text-stone">
      {overridden && <Badge tone="straw">club value</Badge>}
      <span>
        <span className="font-semibold text-soil">{source ? evidenceLabels[source.evidence] : 'source not listed'}</span>
        {source && <>: {shortTitle(source)}</>}
        {note && <> — {note}</>}
      </span>
    </p>
  );
}
