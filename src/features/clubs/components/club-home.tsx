import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import {
  BookOpen,
  CalendarRange,
  Clock,
  CloudRain,
  Coins,
  HandHelping,
  ListOrdered,
  Map as MapIcon,
  Users,
  type LucideIcon,
} from 'lucide-react';
import type { ClubMembership, Role } from '@shared/schemas/auth';
import { roleLabels } from '@shared/schemas/labels';
import { PageHeader } from '@/components/ui/page-header';
import { firstName, joinWords } from '@/lib/format';
import { paths } from '@/lib/paths';

interface HomeCard {
  title: string;
  body: string;
  icon: LucideIcon;
  /** Every card opens a page that works: a card is here only once its feature is. */
  href: string;
}

function cardsFor(role: Role, clubId: number): HomeCard[] {
  switch (role) {
    case 'coordinator':
      return [
        { title: 'Map', body: 'Draw the plots and paths to scale, and see each plot’s neighbours.', icon: MapIcon, href: paths.map(clubId) },
        {
          title: 'Spring round',
          body: 'Renew last season’s holders, then offer free plots to the waiting list in fair order.',
          icon: CalendarRange,
          href: paths.springRound(clubId),
        },
        { title: 'Waiting list', body: 'Everyone waiting for a plot, in the order they applied.', icon: ListOrdered, href: paths.waitlist(clubId) },
        { title: 'Fees', body: 'What each holder owes, what has come in, and deposits held.', icon: Coins, href: paths.fees(clubId) },
        {
          title: 'Members',
          body: 'See everyone in the club, invite new people and check pending invites.',
          icon: Users,
          href: paths.members(clubId),
        },
      ];
    case 'plot_holder':
      return [
        { title: 'Plot book', body: 'Note what you sowed, planted and harvested, and see when to thin, feed and pick.', icon: BookOpen, href: paths.myPlot(clubId) },
        { title: 'Rain gauge', body: 'Read the gauge at your site and log the rain in a few taps.', icon: CloudRain, href: paths.rainGauge(clubId) },
      ];
    case 'volunteer':
      return [
        { title: 'Open shifts', body: 'Watering and weeding shifts that still need a pair of hands.', icon: HandHelping, href: paths.shifts(clubId, '?open=true') },
        { title: 'My hours', body: 'The shifts you have done and the hours you have given.', icon: Clock, href: paths.myShifts(clubId) },
      ];
  }
}

const sectionTitles: Record<Role, string> = {
  coordinator: 'Running the garden',
  plot_holder: 'Your plot',
  volunteer: 'Volunteering',
};

function HomeCardView({ card }: { card: HomeCard }) {
  const { title, body, icon: Icon, href } = card;
  const inner = (
    <>
      <span className="flex size-11 items-center justify-center rounded-lg bg-leaf-50 text-leaf">
        <Icon className="size-6" aria-hidden="true" />
      </span>
      <h3 className="mt-4 text-lg font-semibold text-water group-hover:underline">{title}</h3>
      <p className="mt-1 text-stone">{body}</p>
    </>
  );
  return (
    <li>
      <Link to={href} className="group flex h-full flex-col rounded-xl border border-leaf-100 bg-white p-5 no-underline shadow-sm hover:border-leaf">
        {inner}
      </Link>
    </li>
  );
}

export interface ClubHomeProps {
  club: ClubMembership;
  personName: string;
  /** What comes first under the greeting, before the cards (a holder's own plot). */
  children?: ReactNode;
  /** What a role's section shows above its cards (the coordinator's season at a glance, a volunteer's week). */
  sections?: Partial<Record<Role, ReactNode>>;
}

/** The club's home page: a greeting and one section of cards per role the person holds. */
export function ClubHome({ club, personName, children, sections }: ClubHomeProps) {
  const roles = club.roles;
  const roleWords = roles.map((role) => roleLabels[role].toLowerCase());
  return (
    <>
      <title>{`${club.clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow="Club home"
        title={club.clubName}
        description={
          <p>
            Hello, {firstName(personName)}.{' '}
            {roles.length > 0 ? `You're here as ${joinWords(roleWords)}.` : 'You have no role in this club yet.'}
          </p>
        }
      />
      {children}
      <div className="flex flex-col gap-10">
        {roles.map((role) => {
          const headingId = `home-${role}`;
          return (
            <section key={role} aria-labelledby={headingId}>
              <div className="mb-4 flex flex-wrap items-baseline gap-x-3">
                <h2 id={headingId} className="text-xl font-semibold">
                  {sectionTitles[role]}
                </h2>
                <span className="text-sm text-stone">as {roleLabels[role].toLowerCase()}</span>
              </div>
              {sections?.[role]}
              <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
                {cardsFor(role, club.clubId).map((card) => (
                  <HomeCardView key={card.title} card={card} />
                ))}
              </ul>
            </section>
          );
        })}
      </div>
    </>
  );
}
