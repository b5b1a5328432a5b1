import { useMemo } from 'react';
import type { ColumnDef } from '@tanstack/react-table';
import type { Member } from '@shared/schemas/auth';
import { DataTable } from '@/components/ui/data-table';
import { LocalDate } from '@/lib/time-zone';
import { Badge } from '@/components/ui/badge';
import { MemberActions } from './member-actions';
import { MemberChange } from './member-change';
import { RoleBadges, rolesText } from './role-badges';

const baseColumns: ColumnDef<Member>[] = [
  {
    id: 'name',
    header: 'Name',
    accessorFn: (member) => member.name,
    cell: ({ row }) => <span className="font-medium whitespace-nowrap">{row.original.name}</span>,
  },
  {
    id: 'email',
    header: 'E-mail',
    accessorFn: (member) => member.email,
    cell: ({ row }) => <span className="whitespace-nowrap">{row.original.email}</span>,
  },
  {
    id: 'roles',
    header: 'Roles',
    accessorFn: (member) => rolesText(member.roles),
    cell: ({ row }) => <RoleBadges roles={row.original.roles} />,
  },
  {
    id: 'fee',
    header: 'Fee rate',
    accessorFn: (member) => (member.concession ? 'Concession' : 'Full'),
    cell: ({ row }) => (row.original.concession ? <Badge tone="straw">Concession</Badge> : <span className="text-stone">Full</span>),
  },
  {
    id: 'joined',
    header: 'Joined',
    // ISO strings sort in date order; filtering them would match digits nobody sees, so it is off.
    accessorFn: (member) => member.joinedAt,
    cell: ({ row }) => <span className="whitespace-nowrap"><LocalDate value={row.original.joinedAt} /></span>,
    enableGlobalFilter: false,
  },
];

/** Everyone in the club: sortable, filterable and paged. */
export function MembersTable({ clubId, members }: { clubId: number; members: Member[] }) {
  const columns = useMemo<ColumnDef<Member>[]>(
    () => [
      ...baseColumns,
      {
        id: 'actions',
        header: 'Actions',
        enableSorting: false,
        enableGlobalFilter: false,
        cell: ({ row }) => (
          <div className="flex flex-wrap gap-2">
            <MemberChange clubId={clubId} member={row.original} />
            <MemberActions clubId={clubId} member={row.original} />
          </div>
        ),
      },
    ],
    [clubId],
  );
  return (
    <DataTable
      data={members}
      columns={columns}
      caption="Club members"
      filterLabel="Filter members"
      emptyMessage="No members yet. Invite someone to get the club going."
      initialSorting={[{ id: 'name', desc: false }]}
      getRowId={(member) => String(member.userId)}
    />
  );
}
