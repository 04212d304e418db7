import { useEffect, useMemo, useState } from 'react';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  useReactTable,
  type PaginationState,
  type SortingState,
} from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown, Ban, CheckCircle2, ChevronLeft, ChevronRight, RotateCcw, Search, ShieldCheck, UserMinus } from 'lucide-react';
import { AdminUserSortSchema, type AdminUserSort } from '@/schemas/auth';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { EmptyState, Loading } from '@/components/ui/page';
import { Banner } from '@/components/ui/banner';
import { cn } from '@/utils/cn';
import { useAdminUsers, type AdminUser } from '../api/get-users';
import { useSetUserDisabled } from '../api/set-user-disabled';
import { useSetUserRole } from '../api/set-user-role';

declare module '@tanstack/react-table' {
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface ColumnMeta<TData, TValue> {
    /** Shown beside the value when rows stack as cards on a phone. */
    label?: string;
  }
}

const PAGE_SIZE = 20; // the server's page size (server/services/admin.ts)

const sortOptions: Array<{ value: AdminUserSort; label: string }> = [
  { value: '-created', label: 'Newest members first' },
  { value: 'created', label: 'Oldest members first' },
  { value: 'name', label: 'Name, A to Z' },
  { value: '-name', label: 'Name, Z to A' },
  { value: 'email', label: 'E-mail, A to Z' },
  { value: '-email', label: 'E-mail, Z to A' },
  { value: '-lastSignIn', label: 'Signed in most recently' },
  { value: 'lastSignIn', label: 'Signed in longest ago' },
  { value: '-projects', label: 'Most projects' },
  { value: 'projects', label: 'Fewest projects' },
];

const toSortParam = (s: SortingState): AdminUserSort => {
  const first = s[0];
  const parsed = AdminUserSortSchema.safeParse(first ? `${first.desc ? '-' : ''}${first.id}` : '-created');
  return parsed.success ? parsed.data : '-created';
};
const fromSortParam = (v: AdminUserSort): SortingState => [{ id: v.replace(/^-/, ''), desc: v.startsWith('-') }];

const dateTime = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });
const dateOnly = (iso: string) => new Date(iso).toLocaleDateString(undefined, { dateStyle: 'medium' });

function useDebounced<T>(value: T, ms: number) {
  const [v, setV] = useState(value);
  useEffect(() => {
    const id = setTimeout(() => setV(value), ms);
    return () => clearTimeout(id);
  }, [value, ms]);
  return v;
}

const column = createColumnHelper<AdminUser>();

export function MembersTable({ currentUserId }: { currentUserId: string }) {
  const [sorting, setSorting] = useState<SortingState>(fromSortParam('-created'));
  const [pagination, setPagination] = useState<PaginationState>({ pageIndex: 0, pageSize: PAGE_SIZE });
  const [search, setSearch] = useState('');
  const query = useDebounced(search.trim(), 300);
  const [asking, setAsking] = useState<AdminUser | null>(null);
  const [askingRole, setAskingRole] = useState<AdminUser | null>(null);
  const setDisabled = useSetUserDisabled();
  const setRole = useSetUserRole();

  const sort = toSortParam(sorting);
  const list = useAdminUsers({ query, page: pagination.pageIndex + 1, sort });
  const data = list.data?.users;

  const columns = useMemo(
    () => [
      column.accessor('displayName', {
        id: 'name',
        header: 'Member',
        meta: { label: 'Member' },
        cell: ({ row: { original: u } }) => (
          <div className="min-w-0 text-right sm:text-left">
            <p className="font-bold">
              {u.displayName}
              {u.role === 'admin' ? <span className="ml-2 rounded-full bg-wool px-2 py-0.5 text-xs font-semibold text-ink">Admin</span> : null}
              {u.id === currentUserId ? <span className="ml-2 text-xs font-semibold">(you)</span> : null}
            </p>
            <p className="break-all text-sm text-ink/70 dark:text-oat/70">{u.email}</p>
            {!u.emailVerified ? <p className="text-xs">E-mail not confirmed yet</p> : null}
          </div>
        ),
      }),
      column.accessor('projectCount', {
        id: 'projects',
        header: 'Projects',
        sortDescFirst: true,
        meta: { label: 'Projects' },
        cell: (c) => <span className="tabular font-semibold">{c.getValue()}</span>,
      }),
      column.accessor('lastSignInAt', {
        id: 'lastSignIn',
        header: 'Last sign-in',
        sortDescFirst: true,
        meta: { label: 'Last sign-in' },
        cell: (c) => {
          const v = c.getValue();
          return v ? <time dateTime={v}>{dateTime(v)}</time> : <span className="italic">Never</span>;
        },
      }),
      column.accessor('createdAt', {
        id: 'created',
        header: 'Joined',
        sortDescFirst: true,
        meta: { label: 'Joined' },
        cell: (c) => <time dateTime={c.getValue()}>{dateOnly(c.getValue())}</time>,
      }),
      column.display({
        id: 'status',
        header: 'Status',
        meta: { label: 'Status' },
        cell: ({ row: { original: u } }) =>
          u.disabled ? (
            <span className="inline-flex items-center gap-1 font-semibold text-clay-dark dark:text-[#e59a7c]">
              <Ban aria-hidden className="h-4 w-4" /> Disabled
            </span>
          ) : (
            <span className="inline-flex items-center gap-1 font-semibold text-moss dark:text-[#9cc3a8]">
              <CheckCircle2 aria-hidden className="h-4 w-4" /> Active
            </span>
          ),
      }),
      column.display({
        id: 'action',
        header: () => <span className="sr-only">Action</span>,
        cell: ({ row: { original: u } }) =>
          u.id === currentUserId ? null : (
            <div className="flex w-full flex-wrap gap-2 sm:w-auto sm:flex-nowrap">
              {u.disabled && u.role !== 'admin' ? null : (
                <Button variant="secondary" className="flex-1 sm:flex-none" onClick={() => setAskingRole(u)}>
                  {u.role === 'admin' ? <UserMinus aria-hidden className="h-4 w-4" /> : <ShieldCheck aria-hidden className="h-4 w-4" />}
                  {u.role === 'admin' ? 'Make member' : 'Make admin'}
                  <span className="sr-only"> {u.displayName}</span>
                </Button>
              )}
              <Button variant="secondary" className="flex-1 sm:flex-none" onClick={() => setAsking(u)}>
                {u.disabled ? <RotateCcw aria-hidden className="h-4 w-4" /> : <Ban aria-hidden className="h-4 w-4 text-clay" />}
                {u.disabled ? 'Re-enable' : 'Disable'}
                <span className="sr-only"> {u.displayName}</span>
              </Button>
            </div>
          ),
      }),
    ],
    [currentUserId],
  );

  const table = useReactTable({
    data: data ?? [],
    columns,
    getRowId: (u) => u.id,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    manualFiltering: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    pageCount: list.data?.pageCount ?? -1,
    state: { sorting, pagination },
    onSortingChange: (updater) => {
      setSorting(updater);
      setPagination((p) => ({ ...p, pageIndex: 0 }));
    },
    onPaginationChange: setPagination,
  });

  const confirmChange = () => {
    if (!asking) return;
    setDisabled.mutate({ id: asking.id, disabled: !asking.disabled }, { onSettled: () => setAsking(null) });
  };

  const confirmRole = () => {
    if (!askingRole) return;
    setRole.mutate({ id: askingRole.id, role: askingRole.role === 'admin' ? 'member' : 'admin' }, { onSettled: () => setAskingRole(null) });
  };

  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-3 sm:grid-cols-2">
        <div className="relative">
          <TextField
            label="Find a member"
            type="search"
            placeholder="Name or e-mail"
            value={search}
            onChange={(e) => {
              setSearch(e.currentTarget.value);
              // Any new search starts again from the first page.
              setPagination((p) => ({ ...p, pageIndex: 0 }));
            }}
            autoComplete="off"
            className="[&_input]:pl-11"
          />
          <Search aria-hidden className="pointer-events-none absolute bottom-3.5 left-4 h-5 w-5 text-ink/50 dark:text-oat/50" />
        </div>
        <SelectField label="Sort by" value={sort} onChange={(e) => table.setSorting(fromSortParam(e.currentTarget.value as AdminUserSort))}>
          {sortOptions.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </SelectField>
      </div>

      {list.isPending ? (
        <Loading label="Loading members…" />
      ) : list.isError && !data ? (
        <Banner tone="warning" title="Members could not be loaded">
          {list.error.message}
        </Banner>
      ) : !data?.length ? (
        <EmptyState title={query ? 'No member matches' : 'No members yet'}>{query ? `Nobody's name or e-mail contains “${query}”.` : null}</EmptyState>
      ) : (
        <table className={cn('block w-full border-separate border-spacing-y-2 text-left sm:table', list.isFetching && 'opacity-70')} aria-busy={list.isFetching || undefined}>
          <caption className="sr-only">Members, {list.data?.total} in all</caption>
          <thead className="hidden sm:table-header-group">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const dir = h.column.getIsSorted();
                  return (
                    <th
                      key={h.id}
                      scope="col"
                      className="px-3 text-sm font-semibold"
                      aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : h.column.getCanSort() ? 'none' : undefined}
                    >
                      {h.column.getCanSort() ? (
                        <button type="button" onClick={h.column.getToggleSortingHandler()} className="-ml-2 inline-flex min-h-tap items-center gap-1 rounded-soft px-2 hover:bg-wool dark:hover:bg-white/10">
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          {dir === 'asc' ? <ArrowUp aria-hidden className="h-4 w-4" /> : dir === 'desc' ? <ArrowDown aria-hidden className="h-4 w-4" /> : <ArrowUpDown aria-hidden className="h-4 w-4 opacity-40" />}
                          <span className="sr-only">{dir ? (dir === 'asc' ? ', sorted ascending' : ', sorted descending') : ', sort'}</span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          {/* On a phone each row stacks as a card; from sm up it is an ordinary table row. */}
          <tbody className="flex flex-col gap-3 sm:table-row-group">
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="block rounded-blob bg-white/80 p-4 ring-1 ring-wool sm:table-row sm:rounded-none sm:p-0 dark:bg-[#332e2a] dark:ring-[#4a423c]">
                {row.getVisibleCells().map((cell) => {
                  const label = cell.column.columnDef.meta?.label;
                  return (
                    <td key={cell.id} className="flex items-center justify-between gap-4 py-1.5 sm:table-cell sm:px-3 sm:py-3 sm:align-middle">
                      {label ? <span className="shrink-0 text-sm font-semibold text-ink/70 sm:hidden dark:text-oat/70">{label}</span> : null}
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      )}

      {list.data && list.data.total > 0 ? (
        <nav aria-label="Pages of members" className="grid grid-cols-2 items-center gap-3 sm:flex sm:justify-between">
          <Button variant="secondary" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
            <ChevronLeft aria-hidden className="h-5 w-5" /> Previous
          </Button>
          <p className="order-first col-span-2 text-center text-sm sm:order-none" aria-live="polite">
            Page <span className="tabular">{pagination.pageIndex + 1}</span> of <span className="tabular">{list.data.pageCount}</span> ·{' '}
            <span className="tabular">{list.data.total}</span> {list.data.total === 1 ? 'member' : 'members'}
          </p>
          <Button variant="secondary" className="justify-self-end" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            Next <ChevronRight aria-hidden className="h-5 w-5" />
          </Button>
        </nav>
      ) : null}

      <ConfirmDialog
        open={asking !== null}
        title={asking?.disabled ? `Let ${asking.displayName} back in?` : `Disable ${asking?.displayName ?? ''}?`}
        confirmLabel={asking?.disabled ? 'Re-enable member' : 'Disable member'}
        onConfirm={confirmChange}
        onCancel={() => setAsking(null)}
        pending={setDisabled.isPending}
      >
        {asking?.disabled ? (
          <p>They can sign in again with their password straight away.</p>
        ) : (
          <p>
            They are signed out on every device at once and cannot sign in until an admin re-enables them. Their projects and patterns stay as they are.
          </p>
        )}
      </ConfirmDialog>
      <ConfirmDialog
        open={askingRole !== null}
        title={askingRole?.role === 'admin' ? `Make ${askingRole.displayName} a member again?` : `Make ${askingRole?.displayName ?? ''} an admin?`}
        confirmLabel={askingRole?.role === 'admin' ? 'Make member' : 'Make admin'}
        onConfirm={confirmRole}
        onCancel={() => setAskingRole(null)}
        pending={setRole.isPending}
      >
        {askingRole?.role === 'admin' ? (
          <p>They lose the admin screen and the report queue on their next tap. Their own projects and patterns stay as they are.</p>
        ) : (
          <p>They can see every member's e-mail, disable members and handle reports. Only choose someone you trust with that.</p>
        )}
      </ConfirmDialog>
    </div>
  );
}
