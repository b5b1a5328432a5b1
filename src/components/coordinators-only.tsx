import { ShieldBan } from 'lucide-react';
import { DeadEnd } from '@/components/ui/dead-end';

/** Why each coordinators' page is closed to others: what only coordinators do there. */
const reasons = {
  fees: "Only the club's coordinators see everyone's fees and record payments. Your own fees are on the club home page.",
  sites: "Only the club's coordinators add and change sites. If a site's details look wrong, tell one of them.",
  people: "This page holds people's contact details, so only the club's coordinators see it.",
  settings: "Only the club's coordinators change its name, rules and fees. If something needs changing, tell one of them.",
  members: "Only the club's coordinators can see the member list and send invites. If something here needs changing, ask one of them.",
  findings:
    "The neighbour check of every plot in the club is for the club's coordinators. What it finds on your own plot is in your plot book.",
  tasks:
    "The table of every task on a site is for the club's coordinators. Your own plot's tasks are in your plot book, and every member can see a site's water.",
  'shift-plan': "Only the club's coordinators build shifts from the open tasks. The shifts that need people are on the shift board.",
  hours: "Everyone's volunteer hours are for the club's coordinators. Your own hours are on My shifts.",
  'spring-round':
    "The spring round (renewals, the waiting list and offers) is run by the club's coordinators. A renewal or offer for you comes by e-mail.",
} as const;

export type CoordinatorsPage = keyof typeof reasons;

/** Shown instead of a coordinators' page to someone in the club who is not a coordinator (or when the server answers 403). */
export function CoordinatorsOnly({ clubId, page }: { clubId: number; page: CoordinatorsPage }) {
  return (
    <DeadEnd clubId={clubId} icon={ShieldBan} title="This page is for coordinators">
      <p>{reasons[page]}</p>
    </DeadEnd>
  );
}
