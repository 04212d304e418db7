import { useMemo, useState } from 'react';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown, Pencil, Search, Trash2 } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { yarnWeightLabel } from '@/reference/yarn-weights';
import type { ShelfYarn } from '@/types/api';

const fmt = (n: number) => Math.round(n).toLocaleString();
const fmtSkeins = (n: number) => String(Number(n.toFixed(2)));

function perSkein(y: ShelfYarn) {
  const parts = [y.metersPerSkein ? `${fmt(y.metersPerSkein)} m` : null, y.yardsPerSkein ? `${fmt(y.yardsPerSkein)} yd` : null].filter(Boolean);
  return parts.length ? parts.join(' / ') : '—';
}

function Left({ y, bar = false }: { y: ShelfYarn; bar?: boolean }) {
  if (y.metersLeft == null) return <span className="text-ink/60 dark:text-oat/60">Add a length per skein</span>;
  const none = y.metersLeft === 0;
  const owned = y.metersLeft + (y.metersUsed ?? 0);
  const share = owned > 0 ? y.metersLeft / owned : 0;
  return (
    <span className="flex flex-col gap-1">
      <span className="tabular font-semibold">
        {none ? 'None left · ' : ''}
        {fmt(y.metersLeft)} m · {fmt(y.yardsLeft ?? 0)} yd
        {bar && y.metersUsed ? <span className="font-normal text-ink/70 dark:text-oat/70"> ({fmt(y.metersUsed)} m used)</span> : null}
      </span>
      {bar ? (
        <span aria-hidden className="block h-2 w-full max-w-48 overflow-hidden rounded-full bg-wool dark:bg-[#4a423c]">
          <span className="block h-full rounded-full bg-moss" style={{ width: `${share * 100}%` }} />
        </span>
      ) : null}
    </span>
  );
}

const col = createColumnHelper<ShelfYarn>();

/** The yarn shelf as a table on wide screens and as cards on phones, both from one TanStack Table model. */
export function YarnTable({ yarns, onEdit, onDelete }: { yarns: ShelfYarn[]; onEdit: (y: ShelfYarn) => void; onDelete: (y: ShelfYarn) => void }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'name', desc: false }]);
  const [filter, setFilter] = useState('');
  const columns = useMemo(
    () => [
      col.accessor('name', {
        header: 'Yarn',
        cell: (c) => (
          <span>
            <span className="font-semibold">{c.row.original.name}</span>
            <span className="block text-sm text-ink/70 dark:text-oat/70">{[c.row.original.colour, c.row.original.fibre].filter(Boolean).join(' · ')}</span>
          </span>
        ),
      }),
      col.accessor((y) => y.weight ?? undefined, {
        id: 'weight',
        sortUndefined: 'last',
        header: 'Weight',
        cell: (c) => (c.row.original.weight != null ? yarnWeightLabel(c.row.original.weight) : (c.row.original.ply ?? '—')),
      }),
      col.accessor((y) => y.metersPerSkein ?? (y.yardsPerSkein ? y.yardsPerSkein * 0.9144 : undefined), { id: 'perSkein', sortUndefined: 'last', header: 'Per skein', cell: (c) => <span className="tabular">{perSkein(c.row.original)}</span> }),
      col.accessor('skeinsOwned', { header: 'Skeins', cell: (c) => <span className="tabular">{fmtSkeins(c.getValue())}</span> }),
      col.accessor((y) => y.metersLeft ?? undefined, { id: 'left', sortUndefined: 'last', header: 'Left', cell: (c) => <Left y={c.row.original} /> }),
    ],
    [],
  );
  const table = useReactTable({
    data: yarns,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    // Yarns with no known length sort last either way (sortUndefined above).
    // Find a yarn by any of its words: name, colour, fibre, ply or notes.
    globalFilterFn: (row, _id, value: string) => {
      const y = row.original;
      const hay = [y.name, y.colour, y.fibre, y.ply, y.notes, y.weight != null ? yarnWeightLabel(y.weight) : ''].join(' ').toLowerCase();
      return String(value)
        .toLowerCase()
        .split(/\s+/)
        .filter(Boolean)
        .every((w) => hay.includes(w));
    },
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const rows = table.getRowModel().rows;
  const sortKey = sorting[0] ? `${sorting[0].id}:${sorting[0].desc ? 'desc' : 'asc'}` : 'name:asc';

  const actions = (y: ShelfYarn) => (
    <div className="flex justify-end gap-1">
      <Button variant="quiet" aria-label={`Edit ${y.name}`} onClick={() => onEdit(y)}>
        <Pencil aria-hidden className="h-5 w-5" />
      </Button>
      <Button variant="quiet" aria-label={`Delete ${y.name}`} onClick={() => onDelete(y)} className="text-clay! dark:text-[#e59b7c]!">
        <Trash2 aria-hidden className="h-5 w-5" />
      </Button>
    </div>
  );

  return (
    <div className="flex flex-col gap-4">
      <div className="grid grid-cols-[3fr_2fr] gap-3 sm:grid-cols-[2fr_1fr]">
        <div className="relative">
          <TextField label="Find a yarn" type="search" placeholder="plum, DK…" value={filter} onChange={(e) => setFilter(e.target.value)} className="[&_input]:pl-11" />
          <Search aria-hidden className="pointer-events-none absolute bottom-3.5 left-4 h-5 w-5 text-ink/50 dark:text-oat/50" />
        </div>
        <SelectField
          label="Sort by"
          className="sm:hidden"
          value={sortKey}
          onChange={(e) => {
            const [id, dir] = e.target.value.split(':');
            setSorting([{ id, desc: dir === 'desc' }]);
          }}
        >
          <option value="name:asc">Name</option>
          <option value="left:desc">Most left</option>
          <option value="left:asc">Least left</option>
          <option value="weight:asc">Finest weight</option>
          <option value="skeinsOwned:desc">Most skeins</option>
        </SelectField>
      </div>
      <p className="text-sm text-ink/70 dark:text-oat/70" aria-live="polite">
        {filter ? `${rows.length} of ${yarns.length} yarns match` : `${yarns.length} ${yarns.length === 1 ? 'yarn' : 'yarns'} on the shelf`}
      </p>

      {/* Phones: one card per yarn. */}
      <ul className="flex flex-col gap-3 sm:hidden" aria-label="Yarns">
        {rows.map((row) => {
          const y = row.original;
          return (
            <li key={row.id} className="rounded-blob bg-white/80 p-4 shadow-sm ring-1 ring-wool dark:bg-[#332e2a] dark:ring-[#4a423c]">
              <div className="flex items-start gap-2">
                <div className="min-w-0 flex-1">
                  <p className="text-lg font-bold leading-snug">{y.name}</p>
                  <p className="text-sm text-ink/70 dark:text-oat/70">
                    {[y.colour, y.fibre, y.weight != null ? yarnWeightLabel(y.weight) : y.ply].filter(Boolean).join(' · ') || 'No details yet'}
                  </p>
                </div>
                {actions(y)}
              </div>
              <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
                <dt className="text-ink/70 dark:text-oat/70">Left</dt>
                <dd>
                  <Left y={y} bar />
                </dd>
                <dt className="text-ink/70 dark:text-oat/70">Owned</dt>
                <dd className="tabular">
                  {fmtSkeins(y.skeinsOwned)} {y.skeinsOwned === 1 ? 'skein' : 'skeins'}
                  {y.metersPerSkein || y.yardsPerSkein ? ` of ${perSkein(y)}` : ''}
                </dd>
              </dl>
            </li>
          );
        })}
      </ul>

      {/* Wider screens: the table, sortable by its headers. */}
      <div className="hidden overflow-x-auto rounded-blob ring-1 ring-wool sm:block dark:ring-[#4a423c]">
        <table className="w-full border-collapse text-left">
          <thead className="bg-wool/60 dark:bg-white/5">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const dir = h.column.getIsSorted();
                  return (
                    <th key={h.id} scope="col" aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : 'none'} className="px-2 py-1 font-semibold">
                      <button type="button" onClick={h.column.getToggleSortingHandler()} className="inline-flex min-h-tap items-center gap-1 rounded-soft px-2 hover:bg-wool dark:hover:bg-white/10">
                        {flexRender(h.column.columnDef.header, h.getContext())}
                        {dir === 'asc' ? <ArrowUp aria-hidden className="h-4 w-4" /> : dir === 'desc' ? <ArrowDown aria-hidden className="h-4 w-4" /> : <ArrowUpDown aria-hidden className="h-4 w-4 opacity-40" />}
                      </button>
                    </th>
                  );
                })}
                <th scope="col" className="px-4 py-1">
                  <span className="sr-only">Actions</span>
                </th>
              </tr>
            ))}
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.id} className="border-t border-wool dark:border-[#4a423c]">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-4 py-2 align-middle">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
                <td className="px-2 py-1">{actions(row.original)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
