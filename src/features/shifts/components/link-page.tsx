import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { CalendarCheck, CircleCheck, Clock, Droplets, Fence, HandHeart, Link2Off, MapPin, Sprout, Timer, UsersRound } from 'lucide-react';
import type { Shift, ShiftLinkPreview } from '@shared/schemas/shifts';
import { Alert } from '@/components/ui/alert';
import { Button, buttonClasses } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useClaimByLink } from '../api/claim-by-link';
import { useDoneByLink } from '../api/done-by-link';
import { useReleaseByLink } from '../api/release-by-link';
import { useShiftLink } from '../api/get-shift-link';
import { shiftWhen, shiftWhenWords } from '../lib/dates';
import { waterText } from '../lib/units';
import { estimateText, placesLeftText, placesText, plotsText } from '../lib/words';
import { CautionNote } from './caution-note';
import { DoneForm } from './done-form';

/** The club's name at the top, and whom the link was sent to (it may have been forwarded). */
function LinkHeader({ preview }: { preview: ShiftLinkPreview }) {
  return (
    <div className="flex flex-col gap-1">
      <p className="flex items-center gap-2 font-semibold text-leaf">
        <Sprout className="size-5" aria-hidden="true" /> {preview.clubName}
      </p>
      {preview.forName && <p className="text-sm text-stone">This link is for {preview.forName}. If that is not you, ask the club for your own.</p>}
    </div>
  );
}

/** What the shift is, on its site's clock. */
function ShiftSummary({ shift: s }: { shift: Shift }) {
  const plots = plotsText(s.plotLabels);
  const water = waterText(s.amountL, s.units);
  const row = (Icon: typeof Clock, term: string, value: ReactNode) => (
    <div className="flex items-start gap-2">
      <Icon className="mt-0.5 size-4 shrink-0 text-stone" aria-hidden="true" />
      <dt className="sr-only">{term}</dt>
      <dd className="min-w-0 break-words">{value}</dd>
    </div>
  );
  return (
    <div className="rounded-xl border border-paper-200 bg-paper p-4">
      <p className="text-lg font-semibold break-words">{s.title}</p>
      <dl className="mt-2 flex flex-col gap-1">
        {row(Clock, 'When', shiftWhen(s))}
        {row(MapPin, 'Where', s.siteName)}
        {row(UsersRound, 'Places', `${placesText(s.taken, s.capacity)} · ${placesLeftText(s.taken, s.capacity)}`)}
        {row(Timer, 'Time it takes', estimateText(s.estHours))}
        {plots && row(Fence, 'Plots', plots)}
        {water && row(Droplets, 'Water', `${water} to give`)}
      </dl>
      {s.instructions && <p className="mt-3 text-sm whitespace-pre-line">{s.instructions}</p>}
    </div>
  );
}

/** Other shifts that still need people; taking one needs its own link or signing in. */
function OtherShifts({ shifts }: { shifts: Shift[] }) {
  if (shifts.length === 0) return null;
  return (
    <section aria-labelledby="other-shifts" className="flex flex-col gap-3">
      <h2 id="other-shifts" className="text-lg font-semibold">
        These still need people
      </h2>
      <ul className="flex flex-col gap-3">
        {shifts.map((s) => (
          <li key={s.id} className="rounded-xl border border-paper-200 p-3">
            <p className="font-semibold break-words">{s.title}</p>
            <p className="text-sm">{shiftWhen(s)}</p>
            <p className="text-sm text-stone">
              {s.siteName} · {placesLeftText(s.taken, s.capacity)}
            </p>
          </li>
        ))}
      </ul>
      <p className="text-stone">To take one, use the link in its own e-mail (look in your inbox), or sign in and take a place on the shift board.</p>
      <Link to={paths.signIn()} className={buttonClasses('secondary', 'self-start')}>
        Sign in
      </Link>
    </section>
  );
}

function Ending({ icon: Icon, title, children }: { icon: typeof CircleCheck; title: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-3 text-center">
      <Icon className="mx-auto size-10 text-leaf" aria-hidden="true" />
      <h1 className="text-2xl font-bold">{title}</h1>
      <div className="flex flex-col gap-3 text-left">{children}</div>
    </div>
  );
}

/** Claim links: "Yes, I'll take this shift", then "It's yours"; "Already covered" with other shifts when full. */
function ClaimLink({ token, preview }: { token: string; preview: ShiftLinkPreview }) {
  const claim = useClaimByLink(token);
  const s = preview.shift;
  if (preview.state === 'yours') {
    return (
      <Ending icon={CalendarCheck} title="It's yours">
        <p className="text-center">
          You have a place on <strong>{s.title}</strong>, {shiftWhenWords(s)}, at {s.siteName}.
        </p>
        <p className="text-center text-stone">We have e-mailed you a confirmation with a calendar file, so you can add the shift to your calendar.</p>
        <CautionNote caution={s.caution} />
        <ShiftSummary shift={s} />
      </Ending>
    );
  }
  if (preview.state === 'full') {
    return (
      <div className="flex flex-col gap-4">
        <Ending icon={HandHeart} title="Already covered — thank you">
          <p className="text-center">Every place on {s.title} was taken before you got here. Thank you for offering to help.</p>
        </Ending>
        <OtherShifts shifts={preview.otherShifts} />
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-2xl font-bold">Take this shift?</h1>
      <ShiftSummary shift={s} />
      <CautionNote caution={s.caution} />
      <p>Pressing the button gives you one of its places. Nothing happens until you press it.</p>
      {claim.isError && !isApiError(claim.error, 409) && <Alert tone="error">{claim.error.message}</Alert>}
      <Button className="min-h-12 text-lg" loading={claim.isPending} loadingText="Taking your place…" onClick={() => claim.mutate()}>
        Yes, I'll take this shift
      </Button>
    </div>
  );
}

/** Release links: "Give back my place", then thanks. */
function ReleaseLink({ token, preview }: { token: string; preview: ShiftLinkPreview }) {
  const release = useReleaseByLink(token);
  const s = preview.shift;
  if (release.isSuccess) {
    return (
      <Ending icon={CircleCheck} title="Your place is given back">
        <p className="text-center">Thank you for letting the club know in time. Someone else can take it now.</p>
        <OtherShifts shifts={release.data.otherShifts.filter((o) => o.id !== s.id)} />
      </Ending>
    );
  }
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-2xl font-bold">Give back your place?</h1>
      <ShiftSummary shift={s} />
      <p>Pressing the button gives your place on this shift back, so someone else can take it. Nothing happens until you press it.</p>
      {release.isError && <Alert tone="error">{release.error.message}</Alert>}
      <Button variant="danger" className="min-h-12 text-lg" loading={release.isPending} loadingText="Giving it back…" onClick={() => release.mutate()}>
        Give back my place
      </Button>
    </div>
  );
}

/** Done links: a note, the hours (the estimate to start with) and a photo, then thanks. */
function DoneLink({ token, preview }: { token: string; preview: ShiftLinkPreview }) {
  const done = useDoneByLink(token);
  const s = preview.shift;
  if (done.isSuccess) {
    return (
      <Ending icon={CircleCheck} title="Thank you">
        <p className="text-center">
          {s.title} is marked done, and your hours are counted. The coordinator sees your note{done.variables?.photo ? ' and photo' : ''}.
        </p>
      </Ending>
    );
  }
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-2xl font-bold">How did it go?</h1>
      <ShiftSummary shift={s} />
      <p>Say the shift is done, with a note for the coordinator if you like. Nothing is saved until you press the button.</p>
      <DoneForm estHours={s.estHours} onSubmit={(body, photo) => done.mutateAsync({ body, photo })} />
    </div>
  );
}

/** Links that can no longer be used, each explained. */
function Closed({ preview }: { preview: ShiftLinkPreview }) {
  const s = preview.shift;
  const words: Record<'expired' | 'used' | 'called_off', { title: string; text: string }> = {
    expired: { title: 'This link has expired', text: 'The shift is over, or the link is too old to use. Nothing was changed.' },
    used: { title: 'This link has been used', text: 'Each link works once, and this one already has. Nothing more to do.' },
    called_off: { title: 'This shift is called off', text: 'A coordinator called it off, so nobody needs to come. Thank you for being willing to help.' },
  };
  const w = words[preview.state as keyof typeof words];
  return (
    <div className="flex flex-col gap-4">
      <Ending icon={Link2Off} title={w.title}>
        <p className="text-center">{w.text}</p>
      </Ending>
      <ShiftSummary shift={s} />
      <OtherShifts shifts={preview.otherShifts} />
      {preview.otherShifts.length === 0 && (
        <Link to={paths.signIn()} className={buttonClasses('secondary')}>
          Sign in to see the shifts
        </Link>
      )}
    </div>
  );
}

/**
 * `/shift-link?token=…`: the page a shift e-mail's link opens, with no sign-in. Opening it only
 * shows the shift and says plainly what the button will do; pressing the button does it.
 */
export function ShiftLinkPage({ token }: { token: string | null }) {
  const preview = useShiftLink(token ?? '');

  if (!token) return <ErrorState headingLevel="h1" title="This link is incomplete" message="Open the link from the e-mail again, or copy all of it." />;
  if (preview.isPending) return <LoadingState label="Opening your link…" />;
  if (preview.isError) {
    const notOurs = isApiError(preview.error, 404) || isApiError(preview.error, 400);
    return (
      <ErrorState
        headingLevel="h1"
        title={notOurs ? 'This link is not valid' : 'This link could not be opened'}
        message={notOurs ? 'It may have been cut short when it was copied. Open the link from the e-mail again, or copy all of it.' : preview.error.message}
        onRetry={notOurs ? undefined : () => void preview.refetch()}
        retrying={preview.isFetching}
      />
    );
  }

  const p = preview.data;
  let body: ReactNode;
  // A give-back or done link answers with its new state ("used"); the page keeps its own thanks on screen,
  // because those two do not write their answer into the preview.
  if (p.state === 'expired' || p.state === 'used' || p.state === 'called_off') body = <Closed preview={p} />;
  else if (p.purpose === 'claim') body = <ClaimLink token={token} preview={p} />;
  else if (p.purpose === 'release') body = <ReleaseLink token={token} preview={p} />;
  else body = <DoneLink token={token} preview={p} />;

  return (
    <div className="flex flex-col gap-5">
      <LinkHeader preview={p} />
      {body}
    </div>
  );
}
