import { Link } from 'react-router-dom';
import { CalendarSearch, HandHelping } from 'lucide-react';
import type { Shift } from '@shared/schemas/shifts';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { CardSection, PageSection } from '@/components/ui/page-section';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useMyShifts } from '../api/get-my-shifts';
import { shiftWhen } from '../lib/dates';
import { claimWords, hoursText } from '../lib/words';
import { FeedPanel } from './feed-panel';
import { HoursBar } from './hours-bar';
import { ShiftCard } from './shift-card';
import { StateTag } from './state-tag';
import { VolunteerSettingsForm } from './volunteer-settings-form';

export interface MyShiftsPageProps {
  clubId: number;
  clubName: string;
  timeZone: string;
}

function PastList({ clubId, shifts }: { clubId: number; shifts: Shift[] }) {
  if (shifts.length === 0) return <p className="text-stone">No past shifts yet this season.</p>;
  return (
    <ul className="flex flex-col divide-y divide-paper-200 rounded-xl border border-paper-200 bg-white">
      {shifts.map((s) => (
        <li key={s.id} className="flex flex-col gap-1 p-4 sm:flex-row sm:items-center sm:justify-between sm:gap-4">
          <div className="min-w-0">
            <Link to={paths.shift(clubId, s.id)} className="inline-flex min-h-11 items-center font-semibold break-words">
              {s.title}
            </Link>
            <p className="text-sm">{shiftWhen(s)}</p>
            <p className="text-sm text-stone">
              {s.siteName}
              {s.myClaim ? ` · You: ${claimWords[s.myClaim.status].toLowerCase()}` : ''}
            </p>
          </div>
          <div className="shrink-0">
            <StateTag state={s.state} />
          </div>
        </li>
      ))}
    </ul>
  );
}

/**
 * `/clubs/:clubId/my-shifts` (volunteers): the shifts they have a place on, those done, their hours this
 * season against the club's ask, their shift e-mail choices and their personal calendar address.
 */
export function MyShiftsPage({ clubId, clubName, timeZone }: MyShiftsPageProps) {
  const mine = useMyShifts(clubId);

  let shifts;
  let hours;
  if (mine.isPending) {
    shifts = <LoadingState label="Loading your shifts…" />;
    hours = <LoadingState label="Adding up your hours…" />;
  } else if (mine.isError) {
    const error = (
      <ErrorState
        title="Your shifts didn't load"
        message={mine.error.message}
        requestId={isApiError(mine.error) ? mine.error.requestId : undefined}
        onRetry={() => void mine.refetch()}
        retrying={mine.isFetching}
      />
    );
    shifts = <Card>{error}</Card>;
    hours = <p className="text-stone">Your hours show once your shifts load.</p>;
  } else {
    const { upcoming, past, hours: h, year } = mine.data;
    shifts = (
      <div className="flex flex-col gap-8">
        <PageSection id="my-upcoming" title="Coming up">
          {upcoming.length === 0 ? (
            <Card>
              <EmptyState
                icon={CalendarSearch}
                title="No shifts coming up"
                action={
                  <Link to={paths.shifts(clubId, '?open=true')} className={buttonClasses('primary')}>
                    Find a shift that needs people
                  </Link>
                }
              >
                <p>Take a place on the shift board, or from the link in a shift e-mail.</p>
              </EmptyState>
            </Card>
          ) : (
            <ul className="grid gap-4 md:grid-cols-2">
              {upcoming.map((s) => (
                <li key={s.id} className="min-w-0">
                  <ShiftCard shift={s} href={paths.shift(clubId, s.id)} canClaim withDate />
                </li>
              ))}
            </ul>
          )}
        </PageSection>
        <PageSection id="my-past" title="Done and past">
          <PastList clubId={clubId} shifts={past} />
        </PageSection>
      </div>
    );
    hours = (
      <div className="flex flex-col gap-3">
        <p className="text-stone">
          In {year}: {h.shiftsDone === 1 ? '1 shift done' : `${h.shiftsDone} shifts done`}
          {h.required !== null ? `; the club asks each volunteer for ${hoursText(h.required)} a season.` : '.'}
        </p>
        <HoursBar given={h.hours} required={h.required} remaining={h.remaining} />
      </div>
    );
  }

  return (
    <>
      <title>{`My shifts · ${clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow={clubName}
        title="My shifts"
        description="The shifts you have a place on, the hours you have given, and how the club reaches you about shifts."
        actions={
          <Link to={paths.shifts(clubId)} className={buttonClasses('secondary')}>
            <HandHelping className="size-5" aria-hidden="true" />
            The shift board
          </Link>
        }
      />
      <div className="grid min-w-0 gap-8 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="min-w-0">{shifts}</div>
        <div className="flex min-w-0 flex-col gap-6">
          <CardSection id="my-hours" title="My hours this season">
            {hours}
          </CardSection>
          <CardSection id="my-shift-mail" title="E-mails about shifts">
            <VolunteerSettingsForm clubId={clubId} />
          </CardSection>
          <CardSection id="my-feed" title="Shifts in my calendar">
            <FeedPanel clubId={clubId} kind="personal" timeZone={timeZone} />
          </CardSection>
        </div>
      </div>
    </>
  );
}
