import { useId } from 'react';
import { useNavigate } from 'react-router-dom';
import type { ClubMembership } from '@shared/schemas/auth';
import { inputClasses } from '@/components/ui/field';
import { paths } from '@/lib/paths';

export interface ClubSwitcherProps {
  clubs: ClubMembership[];
  currentClubId: number | null;
}

/** Lets a person in several clubs jump to another club's home; shows just the name when there is one club. */
export function ClubSwitcher({ clubs, currentClubId }: ClubSwitcherProps) {
  const navigate = useNavigate();
  const id = useId();
  const current = clubs.find((club) => club.clubId === currentClubId);

  if (clubs.length <= 1) {
    return current ? (
      <span className="block truncate font-medium text-stone" title={current.clubName}>
        {current.clubName}
      </span>
    ) : null;
  }

  return (
    <div className="flex min-w-0 items-center gap-2">
      <label htmlFor={id} className="text-sm font-medium text-stone">
        Club
      </label>
      <select
        id={id}
        value={current ? String(current.clubId) : ''}
        onChange={(event) => navigate(paths.club(Number(event.target.value)))}
        title={current?.clubName}
        // As wide as the longest club name (up to 24rem), so the chosen name shows in full.
        className={`${inputClasses} w-full cursor-pointer md:w-auto md:max-w-[min(24rem,100%)]`}
      >
        {!current && (
          <option value="" disabled>
            Choose a club
          </option>
        )}
        {clubs.map((club) => (
          <option key={club.clubId} value={club.clubId}>
            {club.clubName}
          </option>
        ))}
      </select>
    </div>
  );
}
