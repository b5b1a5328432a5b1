import { useId, useState } from 'react';
import type { ColumnDef } from '@tanstack/react-table';
import { Download } from 'lucide-react';
import { memberImportOutcomeLabels, type MembersImportResult } from '@shared/schemas/member-imports';
import { buttonClasses } from '@/components/ui/button';
import { checkColumn, CsvImport, rowColumn, twoLineColumn, type PreviewRow } from '@/components/ui/csv-import';
import { inputClasses } from '@/components/ui/field';
import { useImportMembers } from '../api/import-members';
import { allocationsCsvUrl, membersCsvUrl, membersTemplateUrl } from '../api/member-files';
import { RoleBadges } from './role-badges';

type Row = MembersImportResult['rows'][number];

const columns: ColumnDef<PreviewRow<Row>>[] = [
  rowColumn<Row>(),
  twoLineColumn<Row>({ id: 'name', header: 'Name', main: (r) => r.name || '(no name)', sub: (r) => r.email }),
  {
    id: 'roles',
    header: 'Roles',
    accessorFn: (r) => r.member?.roles.join(', ') ?? '',
    cell: ({ row }) => (row.original.member ? <RoleBadges roles={row.original.member.roles} /> : '–'),
  },
  {
    id: 'outcome',
    header: 'What happens',
    accessorFn: (r) => (r.member ? memberImportOutcomeLabels[r.member.outcome] : ''),
    cell: ({ getValue }) => getValue<string>() || '–',
  },
  {
    id: 'invite',
    header: 'Invite',
    accessorFn: (r) => (!r.member ? '' : r.member.sendInvite ? 'Yes' : r.member.hasPassword ? 'No, already signs in' : 'No'),
    cell: ({ getValue }) => <span className="whitespace-nowrap">{getValue<string>() || '–'}</span>,
  },
  checkColumn<Row>(),
];

function doneText(result: MembersImportResult): string {
  const { imported, newAccounts, invitesSent, invitesFailed } = result.counts;
  const parts = [`Imported ${imported} ${imported === 1 ? 'person' : 'people'} (${newAccounts} new).`];
  if (invitesSent > 0) parts.push(`Sent ${invitesSent} ${invitesSent === 1 ? 'invitation' : 'invitations'} to choose a password.`);
  if (invitesFailed > 0) parts.push(`${invitesFailed} ${invitesFailed === 1 ? 'invitation' : 'invitations'} could not be sent; try again from the invite form.`);
  return parts.join(' ');
}

/** Download links for the club's files: members, and who held which plot by season. */
function MemberDownloads({ clubId }: { clubId: number }) {
  const id = useId();
  const [year, setYear] = useState('');
  const y = /^\d{4}$/.test(year) ? Number(year) : undefined;
  return (
    <div className="flex flex-col gap-4 sm:flex-row sm:flex-wrap sm:items-end">
      <a href={membersCsvUrl(clubId)} download className={buttonClasses('secondary')}>
        <Download className="size-5" aria-hidden="true" />
        Members (CSV)
      </a>
      <div className="flex items-end gap-2">
        <div className="flex flex-col gap-1.5">
          <label htmlFor={id} className="text-sm font-medium">
            Season (blank for all)
          </label>
          <input
            id={id}
            inputMode="numeric"
            placeholder="2027"
            value={year}
            onChange={(event) => setYear(event.target.value.trim())}
            className={`${inputClasses} w-28`}
          />
        </div>
        <a href={allocationsCsvUrl(clubId, y)} download className={buttonClasses('secondary')}>
          <Download className="size-5" aria-hidden="true" />
          Plot holders (CSV)
        </a>
      </div>
    </div>
  );
}

/** Adds many members at once from a spreadsheet, optionally inviting them to choose a password, and offers the club's files. */
export function MembersImport({ clubId }: { clubId: number }) {
  const run = useImportMembers(clubId);
  return (
    <div className="flex flex-col gap-8">
      <MemberDownloads clubId={clubId} />
      <div className="flex flex-col gap-4">
        <p className="text-stone">
          One person per row. Roles are coordinator, plot_holder or volunteer; separate several with a semicolon. People
          are added without a password; put yes in send_invite to e-mail them a link to choose one.
        </p>
        <CsvImport
          textLabel="Member rows"
          columnsHint="The first line names the columns: name, email, roles, and optionally send_invite (yes or no)."
          noun={{ one: 'person', many: 'people' }}
          templateUrl={membersTemplateUrl(clubId)}
          check={(csv) => run.mutateAsync({ csv, commit: false })}
          commit={(csv) => run.mutateAsync({ csv, commit: true })}
          columns={columns}
          done={doneText}
        />
      </div>
    </div>
  );
}
