import { roleLabels, type Role } from '@shared/schemas/auth';
import { Badge } from '@/components/ui/badge';

/** What each role lets a person do, in a few words, beside a role's checkbox. */
export const roleHints = {
  coordinator: 'Runs the club: map, members, rounds.',
  plot_holder: 'Keeps a plot and its plot book.',
  volunteer: 'Takes watering and weeding shifts.',
} as const;

/** Role names as plain text, for sorting, filtering and sentences. */
export function rolesText(roles: readonly Role[]): string {
  return roles.map((role) => roleLabels[role]).join(', ');
}

/** One small badge per role. */
export function RoleBadges({ roles }: { roles: readonly Role[] }) {
  return (
    <ul className="flex gap-1.5 whitespace-nowrap" aria-label="Roles">
      {roles.map((role) => (
        <li key={role}>
          <Badge tone={role === 'coordinator' ? 'leaf' : 'neutral'}>{roleLabels[role]}</Badge>
        </li>
      ))}
    </ul>
  );
}
