import { useId, useState } from 'react';
import { Copy, Rss } from 'lucide-react';
import { formatDateTime } from '@shared/dates';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { inputClasses } from '@/components/ui/field';
import { LoadingState } from '@/components/ui/spinner';
import { useFeeds } from '../api/get-feeds';
import { useMakeClubFeed } from '../api/make-club-feed';
import { useMakePersonalFeed } from '../api/make-personal-feed';

export interface FeedPanelProps {
  clubId: number;
  kind: 'personal' | 'club';
  /** The club's zone, for when the address was made. */
  timeZone: string;
}

const words = {
  personal: {
    what: 'Your shifts as a calendar your phone or computer can subscribe to: each shift you take appears there, on the site’s clock, and leaves when you give it back.',
    make: 'Make my calendar address',
    keep: 'Keep this address to yourself: anyone who has it can see your shifts.',
  },
  club: {
    what: 'Every shift of the club as a calendar to subscribe to, for the coordinators or a shared screen at the shed.',
    make: 'Make the club calendar address',
    keep: 'Anyone who has this address can see every shift and its times, but no names.',
  },
} as const;

/**
 * A calendar feed's secret address: made (or made anew) here and shown once, right after, with a Copy
 * button. Making a new one stops the old one working, and the page says so before and after.
 */
export function FeedPanel({ clubId, kind, timeZone }: FeedPanelProps) {
  const feeds = useFeeds(clubId);
  const personal = useMakePersonalFeed(clubId);
  const club = useMakeClubFeed(clubId);
  const make = kind === 'personal' ? personal : club;
  const [confirming, setConfirming] = useState(false);
  const [copied, setCopied] = useState<'yes' | 'no' | null>(null);
  const urlId = `${useId()}-url`;
  const w = words[kind];
  const existing = feeds.data?.[kind] ?? null;
  const made = make.data;

  const doMake = () => {
    setCopied(null);
    make.mutate(undefined, { onSuccess: () => setConfirming(false) });
  };
  const copy = async (url: string) => {
    try {
      await navigator.clipboard.writeText(url);
      setCopied('yes');
    } catch {
      // Some browsers refuse the clipboard outside a secure page; the address is selected to copy by hand.
      setCopied('no');
      (document.getElementById(urlId) as HTMLInputElement | null)?.select();
    }
  };

  return (
    <div className="flex flex-col gap-4">
      <p>{w.what}</p>
      {feeds.isPending ? (
        <LoadingState label="Looking for your calendar address…" />
      ) : feeds.isError ? (
        <Alert tone="error">
          Whether an address exists could not be read: {feeds.error.message}{' '}
          <button type="button" className="inline-flex min-h-11 items-center underline" onClick={() => void feeds.refetch()}>
            Try again
          </button>
        </Alert>
      ) : null}
      {made ? (
        <div className="flex flex-col gap-2">
          <Alert tone="success" title="Your new address">
            Copy it now: it is shown only this once. {existing || made ? 'Any earlier address has stopped working.' : ''}
          </Alert>
          <label htmlFor={urlId} className="font-medium">
            Calendar address
          </label>
          <div className="flex flex-col gap-2 sm:flex-row">
            <input id={urlId} readOnly value={made.url} className={`${inputClasses} font-mono text-sm`} onFocus={(e) => e.currentTarget.select()} />
            <Button variant="secondary" onClick={() => void copy(made.url)}>
              <Copy className="size-5" aria-hidden="true" />
              Copy
            </Button>
          </div>
          <p className="text-sm text-stone" aria-live="polite">
            {copied === 'yes' ? 'Copied. Paste it into your calendar app as a new subscription (often “Add calendar from URL”).' : copied === 'no' ? 'Copying did not work here: the address is selected, copy it with your keyboard or a long press.' : w.keep}
          </p>
        </div>
      ) : existing ? (
        <p className="text-stone">
          An address was made on {formatDateTime(existing.createdAt, timeZone)}. For your safety it is not shown again; make a new one if you need it.
        </p>
      ) : null}
      {make.isError && <Alert tone="error">{make.error.message}</Alert>}
      {confirming ? (
        <div className="flex flex-col gap-3 rounded-lg border border-straw bg-straw-100 p-4" role="group" aria-label="Confirm a new address">
          <p className="font-medium">Make a new address? The old one stops working in every calendar that uses it.</p>
          <div className="flex flex-wrap gap-3">
            <Button loading={make.isPending} loadingText="Making it…" onClick={doMake}>
              Yes, make a new one
            </Button>
            <Button variant="secondary" onClick={() => setConfirming(false)} disabled={make.isPending}>
              Keep the old one
            </Button>
          </div>
        </div>
      ) : (
        <div className="flex flex-col gap-2">
          <Button
            variant={existing || made ? 'secondary' : 'primary'}
            className="self-start"
            loading={make.isPending}
            loadingText="Making it…"
            onClick={() => (existing || made ? setConfirming(true) : doMake())}
          >
            <Rss className="size-5" aria-hidden="true" />
            {existing || made ? 'Make a new address' : w.make}
          </Button>
          {(existing || made) && <p className="text-sm text-stone">Making a new address stops the old one working.</p>}
        </div>
      )}
    </div>
  );
}
