import {
  CalendarRange,
  Coins,
  HandHelping,
  House,
  LandPlot,
  ListChecks,
  ListOrdered,
  Mail,
  MailClock,
  Map as MapIcon,
  ScanSearch,
  Settings,
  Shovel,
  Sprout,
  Timer,
  Users,
  Wheat,
} from 'lucide-react';
import type { ClubMembership } from '@shared/schemas/auth';
import type { NavItem } from '@/components/layouts/app-layout';
import { paths } from '@/lib/paths';

/** The navigation a person sees in one club, built from their roles there; Home comes once, first. */
export function navItemsFor(club: ClubMembership): NavItem[] {
  const id = club.clubId;
  const items: NavItem[] = [{ to: paths.club(id), label: 'Home', icon: House, end: true }];
  if (club.roles.includes('coordinator')) {
    items.push(
      { to: paths.map(id), label: 'Map', icon: MapIcon },
      { to: paths.sites(id), label: 'Sites', icon: LandPlot },
      { to: paths.tasks(id), label: 'Tasks', icon: ListChecks },
      { to: paths.springRound(id), label: 'Spring round', icon: CalendarRange },
      { to: paths.findings(id), label: 'Neighbour check', icon: ScanSearch },
      { to: paths.waitlist(id), label: 'Waiting list', icon: ListOrdered },
      { to: paths.fees(id), label: 'Fees', icon: Coins },
      { to: paths.members(id), label: 'Members', icon: Users },
      { to: paths.messages(id), label: 'Messages', icon: Mail },
      { to: paths.outgoingMail(id), label: 'Outgoing mail', icon: MailClock },
    );
  }
  if (club.roles.includes('plot_holder')) {
    items.push({ to: paths.myPlot(id), label: 'My plot book', icon: Shovel });
  }
  // Every member sees the shift board; volunteers have their own shifts and hours too.
  items.push({ to: paths.shifts(id), label: 'Shifts', icon: HandHelping });
  if (club.roles.includes('volunteer')) {
    items.push({ to: paths.myShifts(id), label: 'My shifts', icon: ListChecks });
  }
  if (club.roles.includes('coordinator')) {
    items.push({ to: paths.volunteerHours(id), label: 'Volunteer hours', icon: Timer });
  }
  items.push({ to: paths.crops(id), label: 'Crop notes', icon: Sprout });
  items.push({ to: paths.harvests(id), label: 'Harvests', icon: Wheat });
  // Settings are visited least, so they come last, after every role's own pages.
  if (club.roles.includes('coordinator')) items.push({ to: paths.clubSettings(id), label: 'Settings', icon: Settings });
  return items;
}
