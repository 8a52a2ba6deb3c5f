import { useEffect, useRef, useState } from 'react';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { Ban, CheckCircle2, Mail, MailCheck, RefreshCw, ShieldAlert, UserCheck, UserX } from 'lucide-react';
import { roles, type Role } from '../../../../shared/auth/roles';
import type { StaffMember } from '../../../../shared/auth/schemas';
import { roleWords, type StaffUpdate } from '../../../../shared/staff/schemas';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useStaff } from '../api/get-staff';
import { useUpdateStaffMember } from '../api/update-staff-member';
import { useResendInvitation } from '../api/resend-invitation';
import { InviteForm } from './invite-form';

type Pending = { member: StaffMember; change: StaffUpdate; question: string; consequence: string; danger: boolean };

function changeFor(member: StaffMember, change: StaffUpdate): Pending {
  if (change.active === false) {
    return { member, change, danger: true, question: `Deactivate ${member.name}?`, consequence: 'They are signed out at once on every device and cannot sign in until reactivated. Their records stay.' };
  }
  if (change.active === true) {
    return { member, change, danger: false, question: `Reactivate ${member.name}?`, consequence: 'They can sign in again with their password.' };
  }
  const role = change.role as Role;
  return {
    member,
    change,
    danger: member.role === 'admin',
    question: `Make ${member.name} ${role === 'admin' ? 'an' : 'a'} ${roleWords[role].toLowerCase()}?`,
    consequence: 'The new role applies from their next screen.',
  };
}

const column = createColumnHelper<StaffMember>();

export function StaffTable() {
  const staff = useStaff();
  const update = useUpdateStaffMember();
  const resend = useResendInvitation();
  const [pending, setPending] = useState<Pending | null>(null);
  const confirmRef = useRef<HTMLDivElement>(null);
  // The question sits above the table: bring it into view when asked from a row further down.
  useEffect(() => {
    if (pending) confirmRef.current?.scrollIntoView?.({ block: 'nearest' });
  }, [pending]);

  const ask = (member: StaffMember, change: StaffUpdate) => {
    update.reset();
    setPending(changeFor(member, change));
  };

  const columns = [
    column.accessor('name', { header: 'Name' }),
    column.accessor('email', { header: 'E-mail' }),
    column.accessor('role', {
      header: 'Role',
      cell: (c) => (
        <select
          aria-label={`Role of ${c.row.original.name}`}
          value={c.getValue()}
          disabled={!c.row.original.active || update.isPending}
          onChange={(e) => ask(c.row.original, { role: e.target.value as Role })}
          className="min-h-target rounded-lg border border-ink/30 bg-paper-raised px-3 py-2"
        >
          {roles.map((role) => (
            <option key={role} value={role}>
              {roleWords[role]}
            </option>
          ))}
        </select>
      ),
    }),
    column.accessor('active', {
      header: 'Status',
      cell: (c) =>
        c.row.original.invited ? (
          <span className="inline-flex items-center gap-1.5">
            <Mail aria-hidden className="h-4 w-4 text-tide-700" /> Invited
          </span>
        ) : c.getValue() ? (
          <span className="inline-flex items-center gap-1.5">
            <CheckCircle2 aria-hidden className="h-4 w-4 text-moss-600" /> Active
          </span>
        ) : (
          <span className="inline-flex items-center gap-1.5 text-ink-muted">
            <Ban aria-hidden className="h-4 w-4" /> Deactivated
          </span>
        ),
    }),
    column.display({
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      cell: (c) =>
        c.row.original.invited ? (
          <Button
            variant="secondary"
            disabled={resend.isPending}
            onClick={() => resend.mutate(c.row.original.id)}
            aria-label={`Resend the invitation to ${c.row.original.name}`}
          >
            <RefreshCw aria-hidden className="h-4 w-4" /> Resend invitation
          </Button>
        ) : c.row.original.active ? (
          <Button variant="secondary" disabled={update.isPending} onClick={() => ask(c.row.original, { active: false })} aria-label={`Deactivate ${c.row.original.name}`}>
            <UserX aria-hidden className="h-4 w-4" /> Deactivate
          </Button>
        ) : (
          <Button variant="secondary" disabled={update.isPending} onClick={() => ask(c.row.original, { active: true })} aria-label={`Reactivate ${c.row.original.name}`}>
            <UserCheck aria-hidden className="h-4 w-4" /> Reactivate
          </Button>
        ),
    }),
  ];

  const table = useReactTable({ data: staff.data ?? [], columns, getCoreRowModel: getCoreRowModel() });

  if (staff.isPending) return <p className="text-ink-muted">Loading staff…</p>;
  if (staff.isError) return <p className="text-ember-700">{staff.error.message}</p>;

  return (
    <div className="flex flex-col gap-4">
      <InviteForm />
      {resend.isError ? (
        <Notice kind="error" title="Invitation not sent">
          {resend.error.message}
        </Notice>
      ) : null}
      {resend.isSuccess ? (
        <p role="status" className="flex items-start gap-2 rounded-lg border-l-4 border-moss-500 bg-moss-50 p-3 text-sm">
          <MailCheck aria-hidden className="mt-0.5 h-4 w-4 shrink-0" />
          <span>
            <strong>New invitation sent</strong> to {resend.data.member.name} ({resend.data.member.email}). Earlier links no longer work.
          </span>
        </p>
      ) : null}
      {update.isError ? (
        <Notice kind="error" title="Not changed">
          {update.error.message}
        </Notice>
      ) : null}
      {pending ? (
        <div ref={confirmRef} role="group" aria-label="Confirm the change" className="flex flex-col gap-3 rounded-xl border-l-4 border-ember-500 bg-paper-raised p-4 ring-1 ring-ink/10">
          <p className="flex items-start gap-2 text-lg font-semibold">
            <ShieldAlert aria-hidden className="mt-1 h-5 w-5 shrink-0" /> {pending.question}
          </p>
          <p className="text-ink-soft">{pending.consequence}</p>
          <div className="flex flex-wrap gap-2">
            <Button
              variant={pending.danger ? 'danger' : 'primary'}
              disabled={update.isPending}
              onClick={() => update.mutate({ id: pending.member.id, body: pending.change }, { onSettled: () => setPending(null) })}
            >
              {update.isPending ? 'Saving…' : 'Confirm'}
            </Button>
            <Button variant="secondary" onClick={() => setPending(null)}>
              Cancel
            </Button>
          </div>
        </div>
      ) : null}
      <div className="overflow-x-auto rounded-xl bg-paper-raised ring-1 ring-ink/10">
        <table className="w-full text-left">
          <caption className="sr-only">Staff of your clinic</caption>
          <thead className="bg-paper-sunk text-sm">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => (
                  <th key={header.id} scope="col" className="px-4 py-3 font-semibold">
                    {flexRender(header.column.columnDef.header, header.getContext())}
                  </th>
                ))}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-t border-ink/10">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-4 py-2">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-sm text-ink-muted">A clinic always keeps at least one active admin: make someone else an admin before changing the last one.</p>
    </div>
  );
}
