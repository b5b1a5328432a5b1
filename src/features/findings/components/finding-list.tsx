import { CAUTION_WORDS, SAFETY_CAUTION } from '@shared/crops/caution';
import { companionCaution } from '@shared/crops/relations';
import { cropSourceById } from '@shared/crops/sources';
import type { FindingView } from '@shared/schemas/findings';
import { evidenceWords, kindWords, peerText, severityWords, sortFindings } from '../lib/wording';
import { FindingMark } from './finding-mark';

const edge: Record<FindingView['severity'], string> = {
  clash: 'border-l-clay-700',
  watch: 'border-l-soil',
  good: 'border-l-leaf',
};

export interface FindingListProps {
  findings: readonly FindingView[];
  /** Names the list for screen readers, e.g. "Findings for Potato". */
  label: string;
  /** Level of each finding's title; the list sits under a heading one level up. */
  headingLevel?: 3 | 4 | 5;
  /** Whether the holder's reason for keeping a clashing planting is shown (the holder and coordinators). */
  showKeptReasons?: boolean;
  emptyText?: string;
}

/** Findings, clashes first, each with its severity in words and a mark of its own, what it is about, and where it comes from. */
export function FindingList({ findings, label, headingLevel = 3, showKeptReasons = true, emptyText = 'Nothing found for this planting.' }: FindingListProps) {
  if (findings.length === 0) return <p className="text-stone">{emptyText}</p>;
  const Heading = `h${headingLevel}` as const;
  const companionHabit = findings.some((f) => f.kind === 'companion' && f.source.evidence !== 'research');
  const habitSource = cropSourceById(companionCaution.source);
  return (
    <div className="flex min-w-0 flex-col gap-3">
      <ul aria-label={label} className="flex flex-col gap-3">
        {sortFindings(findings).map((f) => (
          <li key={`${f.plantingId}-${f.key}`} className={`min-w-0 rounded-lg border border-l-4 border-paper-200 bg-white p-3 sm:p-4 ${edge[f.severity]}`}>
            <p className="flex flex-wrap items-center gap-x-2 text-sm font-semibold">
              <FindingMark kind={f.severity} />
              <span>{severityWords[f.severity]}</span>
              <span className="font-normal text-stone">· {kindWords[f.kind]}</span>
            </p>
            <Heading className="mt-1 font-semibold break-words">{f.title}</Heading>
            <p className="mt-1 break-words">{f.message}</p>
            {CAUTION_WORDS.test(f.message) && <p className="mt-1 text-sm">{SAFETY_CAUTION}</p>}
            {f.peers.length > 0 && (
              <p className="mt-1 text-sm break-words">
                <span className="font-medium">With:</span> {f.peers.map((p) => peerText(p, f)).join('; ')}
              </p>
            )}
            {showKeptReasons && f.severity === 'clash' && f.keptReason && (
              <p className="mt-2 rounded-md bg-paper-100 px-3 py-2 break-words whitespace-pre-line">
                <span className="font-semibold">Kept:</span> {f.keptReason}
              </p>
            )}
            <p className="mt-2 text-sm text-stone break-words">
              Source:{' '}
              {f.source.url ? (
                <a href={f.source.url} target="_blank" rel="noreferrer" className="underline">
                  {f.source.title}
                </a>
              ) : (
                f.source.title
              )}{' '}
              ({evidenceWords(f.source.evidence)})
            </p>
          </li>
        ))}
      </ul>
      {companionHabit && (
        <p className="text-sm text-stone">
          {companionCaution.value}
          {habitSource && ` (published source: ${habitSource.title})`}
        </p>
      )}
    </div>
  );
}
