import { useMemo } from 'react';
import type { ColumnDef } from '@tanstack/react-table';
import type { Invite } from '@shared/schemas/auth';
import { Badge } from '@/components/ui/badge';
import { DataTable } from '@/components/ui/data-table';
import { LocalDate } from '@/lib/time-zone';
import { InviteActions } from './invite-actions';
import { RoleBadges, rolesText } from './role-badges';

const baseColumns: ColumnDef<Invite>[] = [
  {
    id: 'email',
    header: 'E-mail',
    accessorFn: (invite) => invite.email,
    cell: ({ row }) => <span className="font-medium whitespace-nowrap">{row.original.email}</span>,
  },
  {
    id: 'name',
    header: 'Name',
    accessorFn: (invite) => invite.name,
    cell: ({ row }) => <span className="whitespace-nowrap">{row.original.name}</span>,
  },
  {
    id: 'roles',
    header: 'Roles',
    accessorFn: (invite) => rolesText(invite.roles),
    cell: ({ row }) => <RoleBadges roles={row.original.roles} />,
  },
  {
    id: 'expires',
    header: 'Expires',
    accessorFn: (invite) => invite.expiresAt,
    cell: ({ row }) => (
      <span className="whitespace-nowrap">
        {Date.parse(row.original.expiresAt) <= Date.now() ? (
          <Badge tone="straw">
            Expired <LocalDate value={row.original.expiresAt} />
          </Badge>
        ) : (
          <LocalDate value={row.original.expiresAt} />
        )}
      </span>
    ),
    enableGlobalFilter: false,
  },
];

/** Invites sent but not yet accepted, those expired lately too (they can be sent again). */
export function InvitesTable({ clubId, invites }: { clubId: number; invites: Invite[] }) {
  const columns = useMemo<ColumnDef<Invite>[]>(
    () => [
      ...baseColumns,
      {
        id: 'actions',
        header: 'Actions',
        enableSorting: false,
        enableGlobalFilter: false,
        cell: ({ row }) => <InviteActions clubId={clubId} invite={row.original} />,
      },
    ],
    [clubId],
  );
  return (
    <DataTable
      data={invites}
      columns={columns}
      caption="Pending invites"
      filterLabel="Filter invites"
      emptyMessage="No invites waiting. New invites show up here until they are accepted."
      initialSorting={[{ id: 'expires', desc: false }]}
      pageSizes={[5, 10, 25]}
      getRowId={(invite) => String(invite.id)}
    />
  );
}
