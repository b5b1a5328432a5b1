import { Link } from 'react-router-dom';
import { CheckCircle2, Circle } from 'lucide-react';
import type { ChecklistStep } from '@shared/schemas/club-signups';
import { Button } from '@/components/ui/button';
import { paths } from '@/lib/paths';
import { useChecklist, useSetChecklistHidden } from '../api/checklist';

interface StepWords {
  title: string;
  help: string;
  link: string;
  href: (clubId: number) => string;
}

// Each step opens the page that already does it; every one of those pages lets the coordinator edit or undo.
const steps: Record<ChecklistStep, StepWords> = {
  site: {
    title: 'Create a site',
    help: 'A site is a piece of ground the club gardens: give its name, where it is and its size. You can edit it or archive it later.',
    link: 'Go to Sites',
    href: (id) => paths.sites(id),
  },
  plots: {
    title: 'Draw or import plots',
    help: 'Add plots on the map and drag them into place, or bring a list in from a spreadsheet. Plots can be moved, resized or removed at any time.',
    link: 'Open the map',
    href: (id) => paths.map(id),
  },
  members: {
    title: 'Import or invite members',
    help: 'Invite people one by one, or import a list of current members. Roles can be changed and invitations cancelled afterwards.',
    link: 'Go to Members',
    href: (id) => paths.members(id),
  },
  waitlist: {
    title: 'Bring in the waiting list',
    help: 'Import the people already waiting, in their order, or share the club’s application form. Anyone can be moved or taken off the list.',
    link: 'Go to the waiting list',
    href: (id) => paths.waitlist(id),
  },
  fees: {
    title: 'Set the fees',
    help: 'Say what a plot costs, by kind or by area, and any deposit or concession. You can change the schedule until fees are charged.',
    link: 'Go to Settings',
    href: (id) => paths.clubSettings(id),
  },
  season: {
    title: 'Open the season',
    help: 'Opening a season shows you who would get a renewal first, and sends nothing until you confirm. Do this once the plots and holders are in.',
    link: 'Go to the spring round',
    href: (id) => paths.springRound(id),
  },
};

/** The first-run checklist on a new club's coordinator home; each step's state comes from the server. */
export function FirstRunChecklist({ clubId }: { clubId: number }) {
  const checklist = useChecklist(clubId);
  const hide = useSetChecklistHidden(clubId);
  if (!checklist.data || checklist.data.hidden) return null;
  const list = checklist.data.steps;
  const doneCount = list.filter((s) => s.done).length;
  // A club with every step done needs no checklist (settings can still bring it back).
  if (doneCount === list.length) return null;
  return (
    <section aria-labelledby="first-run" className="mb-6 rounded-xl border border-leaf-100 bg-white p-5 shadow-sm">
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <h3 id="first-run" className="text-lg font-semibold">
          Getting started
        </h3>
        <p className="text-sm text-stone">{`${doneCount} of ${list.length} done`}</p>
      </div>
      <ol className="mt-4 flex flex-col gap-4">
        {list.map((step) => {
          const words = steps[step.key];
          return (
            <li key={step.key} className="flex gap-3" data-step={step.key} data-done={step.done}>
              {step.done ? (
                <CheckCircle2 className="size-5 shrink-0 text-leaf" aria-hidden="true" />
              ) : (
                <Circle className="size-5 shrink-0 text-stone" aria-hidden="true" />
              )}
              <div className="min-w-0">
                <p className="font-semibold">
                  {words.title}
                  <span className="sr-only">{step.done ? ' (done)' : ' (not done yet)'}</span>
                </p>
                <p className="text-stone">{words.help}</p>
                <Link to={words.href(clubId)} className="inline-flex min-h-11 items-center underline">
                  {words.link}
                </Link>
              </div>
            </li>
          );
        })}
      </ol>
      <Button type="button" variant="secondary" className="mt-4" onClick={() => hide.mutate(true)} loading={hide.isPending} loadingText="Hiding…">
        Hide this checklist
      </Button>
      <p className="mt-2 text-sm text-stone">You can bring it back from the club’s settings.</p>
    </section>
  );
}

/** The settings line that hides the checklist or brings it back. */
export function ChecklistSetting({ clubId }: { clubId: number }) {
  const checklist = useChecklist(clubId);
  const set = useSetChecklistHidden(clubId);
  if (!checklist.data) return null;
  const hidden = checklist.data.hidden;
  return (
    <section aria-labelledby="checklist-setting" className="min-w-0">
      <h2 id="checklist-setting" className="mb-2 text-xl font-semibold">
        Getting-started checklist
      </h2>
      <p className="mb-3">
        {hidden ? 'The checklist is hidden from the club’s home page.' : 'The checklist shows on the club’s home page until every step is done.'}
      </p>
      <Button type="button" variant="secondary" onClick={() => set.mutate(!hidden)} loading={set.isPending} loadingText="Saving…">
        {hidden ? 'Show the checklist again' : 'Hide the checklist'}
      </Button>
    </section>
  );
}
