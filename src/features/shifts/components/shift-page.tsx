import { useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Ban, ChevronLeft, Image, Mail, Pencil, SearchX, TriangleAlert } from 'lucide-react';
import type { ShiftDetail, ShiftPerson } from '@shared/schemas/shifts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DeadEnd } from '@/components/ui/dead-end';
import { ErrorState } from '@/components/ui/error-state';
import { NoticeToast, type Notice } from '@/components/ui/notice-toast';
import { PageHeader } from '@/components/ui/page-header';
import { CardSection } from '@/components/ui/page-section';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useShift } from '../api/get-shift';
import { coordinatorActions } from '../lib/actions';
import { shiftWhen } from '../lib/dates';
import { waterText } from '../lib/units';
import { claimWords, estimateText, hoursText, kindWords, placesLeftText, placesText, plotsText, stateExplained } from '../lib/words';
import { askResultText, AskHelpDialog } from './ask-help-dialog';
import { CallOffDialog } from './call-off-dialog';
import { CautionNote } from './caution-note';
import { KindTag } from './kind-tag';
import { ShiftActions } from './shift-actions';
import { ShiftEditDialog } from './shift-edit-dialog';
import { StateTag } from './state-tag';

export interface ShiftPageProps {
  clubId: number;
  clubName: string;
  shiftId: number;
  canClaim: boolean;
  isCoordinator: boolean;
}

function Facts({ rows }: { rows: Array<[string, ReactNode] | null> }) {
  return (
    <dl className="grid grid-cols-1 gap-x-6 gap-y-2 sm:grid-cols-[auto_1fr]">
      {rows
        .filter((r): r is [string, ReactNode] => r !== null)
        .map(([term, value]) => (
          <div key={term} className="contents">
            <dt className="text-stone">{term}</dt>
            <dd className="mb-2 min-w-0 break-words font-medium sm:mb-0">{value}</dd>
          </div>
        ))}
    </dl>
  );
}

function Tasks({ shift }: { shift: ShiftDetail }) {
  if (shift.tasks.length === 0) return <p className="text-stone">No tasks are tied to this shift: it is a work day. The instructions say what to do.</p>;
  return (
    <ul className="flex flex-col gap-3">
      {shift.tasks.map((t) => (
        <li key={t.id} className="rounded-lg border border-paper-200 p-3">
          <p className="font-semibold break-words">{t.title}</p>
          <p className="text-sm text-stone">{[t.plotLabel ? `Plot ${t.plotLabel}` : 'Whole site', t.cropName].filter(Boolean).join(' · ')}</p>
          {t.kind === 'water' && t.amountL !== null && <p className="mt-1 text-sm font-medium">{waterText(t.amountL, shift.units)}</p>}
          {t.details && <p className="mt-1 text-sm whitespace-pre-line">{t.details}</p>}
          {t.caution && (
            <p className="mt-2 flex items-start gap-2 text-sm text-soil">
              <TriangleAlert className="mt-0.5 size-4 shrink-0" aria-hidden="true" />
              <span>
                <span className="font-semibold">Take care: </span>
                {t.caution}
              </span>
            </p>
          )}
        </li>
      ))}
    </ul>
  );
}

function People({ people, shiftId }: { people: ShiftPerson[]; shiftId: number }) {
  if (people.length === 0) return <p className="text-stone">Nobody has taken a place yet.</p>;
  return (
    <ul className="flex flex-col divide-y divide-paper-200">
      {people.map((p) => (
        <li key={p.claimId} className="flex flex-col gap-1 py-3 first:pt-0 last:pb-0">
          <p className="flex flex-wrap items-baseline gap-x-2">
            <span className="font-semibold">{p.name}</span>
            <span className="text-stone">{claimWords[p.status]}</span>
            {p.hours !== null && <span className="text-stone">· {hoursText(p.hours)}</span>}
          </p>
          {p.note && <p className="whitespace-pre-line">“{p.note}”</p>}
          {p.hasPhoto && (
            <a
              href={`/api/shifts/${shiftId}/claims/${p.claimId}/photo`}
              target="_blank"
              rel="noreferrer"
              className="inline-flex min-h-11 items-center gap-1.5 self-start text-sm font-medium underline"
            >
              <Image className="size-4" aria-hidden="true" />
              See {p.name}’s photo
            </a>
          )}
        </li>
      ))}
    </ul>
  );
}

/**
 * `/clubs/:clubId/shifts/:shiftId`: everything about one shift: when and where (on the site's clock),
 * places and hours, the caution, instructions and tasks; the person's buttons; for coordinators the
 * people with their notes and hours, and editing, asking for help by e-mail and calling it off.
 */
export function ShiftPage({ clubId, clubName, shiftId, canClaim, isCoordinator }: ShiftPageProps) {
  const shift = useShift(shiftId);
  const [dialog, setDialog] = useState<'edit' | 'call-off' | 'ask' | null>(null);
  const [notice, setNotice] = useState<Notice | null>(null);

  if (shift.isPending) return <LoadingState label="Loading the shift…" />;
  if (shift.isError) {
    if (isApiError(shift.error, 404)) {
      return (
        <DeadEnd clubId={clubId} icon={SearchX} title="This shift isn't here">
          <p>It may have been removed, or the link may be from another club. The board has every shift that is planned.</p>
          <p className="mt-2">
            <Link to={paths.shifts(clubId)}>Open the shift board</Link>
          </p>
        </DeadEnd>
      );
    }
    return (
      <ErrorState
        title="The shift didn't load"
        message={shift.error.message}
        requestId={isApiError(shift.error) ? shift.error.requestId : undefined}
        onRetry={() => void shift.refetch()}
        retrying={shift.isFetching}
      />
    );
  }

  const s = shift.data;
  const plots = plotsText(s.plotLabels, { all: true });
  const water = waterText(s.amountL, s.units);
  const live = s.state === 'needs_people' || s.state === 'covered';
  const can = coordinatorActions(s);
  const close = () => setDialog(null);

  return (
    <>
      <title>{`${s.title} · Shifts · ${clubName} · Tillwell`}</title>
      <p className="mb-3">
        <Link to={paths.shifts(clubId, `?date=${s.date}`)} className="inline-flex min-h-11 items-center gap-1">
          <ChevronLeft className="size-4" aria-hidden="true" />
          The week on the board
        </Link>
      </p>
      <PageHeader
        eyebrow={`${s.siteName} · ${kindWords[s.kind]}`}
        title={<span className={s.state === 'called_off' ? 'line-through decoration-2' : ''}>{s.title}</span>}
        description={shiftWhen(s)}
        actions={
          isCoordinator && can.edit ? (
            <>
              <Button variant="secondary" onClick={() => setDialog('edit')}>
                <Pencil className="size-5" aria-hidden="true" />
                Edit
              </Button>
              {can.askForHelp && (
                <Button variant="secondary" onClick={() => setDialog('ask')}>
                  <Mail className="size-5" aria-hidden="true" />
                  Ask for help by e-mail
                </Button>
              )}
              {can.callOff && (
                <Button variant="danger" onClick={() => setDialog('call-off')}>
                  <Ban className="size-5" aria-hidden="true" />
                  Call off
                </Button>
              )}
            </>
          ) : undefined
        }
      />
      <div className="grid min-w-0 gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="flex min-w-0 flex-col gap-6">
          <Card className="flex flex-col gap-4">
            <div className="flex flex-wrap items-center gap-2">
              <StateTag state={s.state} />
              <KindTag kind={s.kind} />
            </div>
            <p>{stateExplained[s.state]}</p>
            <Facts
              rows={[
                ['When', shiftWhen(s)],
                ['Where', s.siteName],
                ['Places', `${placesText(s.taken, s.capacity)}${live ? ` · ${placesLeftText(s.taken, s.capacity)}` : ''}`],
                ['Time it takes', estimateText(s.estHours)],
                plots ? ['Plots', plots] : null,
                water ? ['Water', `${water} to give`] : null,
              ]}
            />
            {/* Everyone sees the caution, right above the buttons. */}
            <CautionNote caution={s.caution} />
            <ShiftActions shift={s} canClaim={canClaim} withCaution={false} />
          </Card>
          <CardSection id="shift-instructions" title="Instructions">
            {s.instructions ? <p className="whitespace-pre-line">{s.instructions}</p> : <p className="text-stone">No instructions were added. The tasks say what needs doing.</p>}
          </CardSection>
          <CardSection id="shift-tasks" title={s.taskCount === 1 ? 'The task' : `The tasks (${s.taskCount})`}>
            <Tasks shift={s} />
          </CardSection>
        </div>
        {isCoordinator && (
          <div className="flex min-w-0 flex-col gap-6">
            <CardSection id="shift-people" title="People">
              {s.people ? <People people={s.people} shiftId={s.id} /> : <Alert tone="info">The names of the people on a shift are shown to coordinators only.</Alert>}
            </CardSection>
          </div>
        )}
      </div>
      {isCoordinator && (
        <>
          <ShiftEditDialog
            open={dialog === 'edit'}
            shift={s}
            onClose={close}
            onSaved={() => {
              close();
              setNotice({ tone: 'success', text: 'The shift is saved.' });
            }}
          />
          <CallOffDialog
            open={dialog === 'call-off'}
            shift={s}
            onClose={close}
            onDone={() => {
              close();
              setNotice({ tone: 'success', text: 'The shift is called off.' });
            }}
          />
          <AskHelpDialog
            open={dialog === 'ask'}
            shift={s}
            onClose={close}
            onSent={(result) => {
              close();
              setNotice({ tone: 'success', text: askResultText(result) });
            }}
          />
        </>
      )}
      <NoticeToast notice={notice} onDismiss={() => setNotice(null)} />
    </>
  );
}
