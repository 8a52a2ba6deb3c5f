import { createColumnHelper, flexRender, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import type { StaffMember } from '../../../../shared/auth/schemas';
import { useStaff } from '../api/get-staff';

const column = createColumnHelper<StaffMember>();
const columns = [
  column.accessor('name', { header: 'Name' }),
  column.accessor('email', { header: 'E-mail' }),
  column.accessor('role', { header: 'Role', cell: (c) => c.getValue().charAt(0).toUpperCase() + c.getValue().slice(1) }),
  column.accessor('active', { header: 'Status', cell: (c) => (c.getValue() ? 'Active' : 'Deactivated') }),
];

export function StaffTable() {
  const staff = useStaff();
  const table = useReactTable({ data: staff.data ?? [], columns, getCoreRowModel: getCoreRowModel() });

  if (staff.isPending) return <p className="text-ink-muted">Loading staff…</p>;
  if (staff.isError) return <p className="text-ember-700">{staff.error.message}</p>;

  return (
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
                <td key={cell.id} className="px-4 py-3">
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
