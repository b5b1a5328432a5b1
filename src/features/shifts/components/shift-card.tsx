import { useId, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Clock, Droplets, MapPin, Timer, UsersRound, Fence } from 'lucide-react';
import type { Shift } from '@shared/schemas/shifts';
import { shiftTimes, shiftWhen } from '../lib/dates';
import { waterText } from '../lib/units';
import { estimateText, placesLeftText, placesText, plotsText } from '../lib/words';
import { KindTag } from './kind-tag';
import { ShiftActions } from './shift-actions';
import { StateTag } from './state-tag';

export interface ShiftCardProps {
  shift: Shift;
  /** Where the title leads: the shift's own page. */
  href: string;
  canClaim: boolean;
  /** Show the date as well as the time (lists not grouped by day). */
  withDate?: boolean;
  headingLevel?: 'h3' | 'h4';
  /** Something more under the facts, such as the person's own note on a past shift. */
  children?: ReactNode;
}

function Fact({ icon: Icon, label, children }: { icon: typeof Clock; label: string; children: ReactNode }) {
  return (
    <li className="flex items-start gap-2">
      <Icon className="mt-0.5 size-4 shrink-0 text-stone" aria-hidden="true" />
      <span className="min-w-0 break-words">
        <span className="sr-only">{label}: </span>
        {children}
      </span>
    </li>
  );
}

/**
 * One shift on the board, phone first: its state (word and icon), kind, title (a link to the shift),
 * time on the site's clock, site, places, hours, plots and water, then the person's buttons with the caution.
 */
export function ShiftCard({ shift: s, href, canClaim, withDate = false, headingLevel: Heading = 'h3', children }: ShiftCardProps) {
  const titleId = `${useId()}-title`;
  const water = waterText(s.amountL, s.units);
  const plots = plotsText(s.plotLabels);
  return (
    <article aria-labelledby={titleId} className={`flex min-w-0 flex-col gap-3 rounded-xl border bg-white p-4 shadow-sm ${s.state === 'called_off' ? 'border-paper-300' : 'border-paper-200'}`}>
      <div className="flex flex-wrap items-center gap-2">
        <StateTag state={s.state} />
        <KindTag kind={s.kind} />
      </div>
      <div className="min-w-0">
        <Heading id={titleId} className="text-lg font-semibold break-words">
          <Link to={href} className={`inline-flex min-h-11 items-center ${s.state === 'called_off' ? 'line-through decoration-2' : ''}`}>
            {s.title}
          </Link>
        </Heading>
        <ul className="mt-1 flex flex-col gap-1">
          <Fact icon={Clock} label="When">
            {withDate ? shiftWhen(s) : shiftTimes(s)}
          </Fact>
          <Fact icon={MapPin} label="Site">
            {s.siteName}
          </Fact>
          <Fact icon={UsersRound} label="Places">
            {placesText(s.taken, s.capacity)}
            {s.state === 'needs_people' && <span className="text-stone"> · {placesLeftText(s.taken, s.capacity)}</span>}
          </Fact>
          <Fact icon={Timer} label="Time it takes">
            {estimateText(s.estHours)}
          </Fact>
          {plots && (
            <Fact icon={Fence} label="Plots">
              {plots}
            </Fact>
          )}
          {water && (
            <Fact icon={Droplets} label="Water">
              {water} to give
            </Fact>
          )}
        </ul>
      </div>
      {children}
      <ShiftActions shift={s} canClaim={canClaim} compact />
    </article>
  );
}
