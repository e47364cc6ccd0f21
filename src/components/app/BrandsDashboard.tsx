// The dashboard: every brand the caller can see, and a form to start a new one.
import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { createColumnHelper, flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import type { BrandRole } from '@/lib/auth/roles';
import { ROLE_LABELS } from '@/lib/auth/roles';
import { api, ApiClientError } from '@/lib/client/api';
import { QueryRoot } from './QueryRoot';
import { When } from '@/components/ui/When';

interface BrandRow {
  id: string;
  name: string;
  slug: string;
  role: BrandRole;
  updatedAt: string;
}

const column = createColumnHelper<BrandRow>();

const columns = [
  column.accessor('name', {
    header: 'Brand',
    cell: (c) => (
      <a href={`/app/brands/${c.row.original.id}`} className="font-semibold text-ink hover:text-plumb hover:underline">
        {c.getValue()}
      </a>
    ),
  }),
  column.accessor('slug', { header: 'Public address', cell: (c) => <span className="font-mono text-sm text-ink-soft">/b/{c.getValue()}</span> }),
  column.accessor('role', { header: 'Your role', cell: (c) => <RoleBadge role={c.getValue()} /> }),
  column.accessor('updatedAt', { header: 'Last changed', cell: (c) => <When className="text-ink-soft" value={c.getValue()} /> }),
];

export function RoleBadge({ role }: { role: BrandRole }) {
  return (
    <span title={ROLE_LABELS[role].summary} className="inline-block rounded-full border border-rule-strong px-2.5 py-0.5 text-xs font-semibold text-ink-soft">
      {ROLE_LABELS[role].label}
    </span>
  );
}

function BrandsTable() {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'name', desc: false }]);
  const brands = useQuery({ queryKey: ['brands'], queryFn: () => api<{ brands: BrandRow[] }>('/api/brands').then((r) => r.brands) });
  const table = useReactTable({
    data: brands.data ?? [],
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

  if (brands.isPending) return <p className="panel px-6 py-10 text-center text-ink-soft" role="status">Loading your brands…</p>;
  if (brands.isError)
    return (
      <div role="alert" className="panel border-danger/30 px-6 py-8 text-center">
        <p className="font-semibold text-danger">Your brands could not be loaded.</p>
        <p className="mt-1 text-sm text-ink-soft">{brands.error.message}</p>
        <button className="btn-quiet mt-4" onClick={() => brands.refetch()}>Try again</button>
      </div>
    );
  if (brands.data.length === 0)
    return (
      <div className="panel self-start px-6 py-12 text-center">
        <p className="text-lg font-semibold">No brands yet</p>
        <p className="mt-1 text-ink-soft">Start one with the form beside this list: give it the client's name, then add their logo and colours.</p>
      </div>
    );

  return (
    <div className="panel self-start overflow-x-auto">
      <table className="w-full text-left text-sm" aria-label="Your brands">
        <thead className="border-b border-rule text-xs uppercase tracking-wider text-ink-faint">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => {
                const sorted = h.column.getIsSorted();
                return (
                  <th key={h.id} scope="col" className="px-5 py-3 font-semibold" aria-sort={sorted ? (sorted === 'asc' ? 'ascending' : 'descending') : 'none'}>
                    <button type="button" className="inline-flex items-center gap-1 uppercase hover:text-ink" onClick={h.column.getToggleSortingHandler()}>
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      <span aria-hidden="true">{sorted === 'asc' ? '↑' : sorted === 'desc' ? '↓' : ''}</span>
                    </button>
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="border-b border-rule last:border-0 hover:bg-paper/60">
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="px-5 py-3.5">{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

const newBrandSchema = z.object({
  name: z.string().trim().min(1, 'Give the brand a name.').max(120, 'A brand name can be at most 120 characters.'),
});

function NewBrandForm() {
  const queryClient = useQueryClient();
  const { register, handleSubmit, reset, formState: { errors } } = useForm<{ name: string }>({ resolver: zodResolver(newBrandSchema) });
  const create = useMutation({
    mutationFn: (name: string) => api<{ brand: BrandRow }>('/api/brands', { method: 'POST', body: { name } }),
    onSuccess: () => {
      reset({ name: '' });
      return queryClient.invalidateQueries({ queryKey: ['brands'] });
    },
  });
  const onSubmit = handleSubmit((v) => create.mutate(v.name));
  return (
    <form onSubmit={onSubmit} noValidate className="panel space-y-4 self-start p-6" aria-labelledby="new-brand-title">
      <h2 id="new-brand-title" className="text-lg font-bold">Start a brand</h2>
      <div>
        <label htmlFor="brand-name" className="label">Client or brand name</label>
        <input id="brand-name" className="field" placeholder="e.g. Harbour Bakehouse" aria-invalid={!!errors.name} aria-describedby="brand-name-note" {...register('name')} />
        <p id="brand-name-note" className={errors.name ? 'error-text' : 'hint'}>
          {errors.name?.message ?? 'You become its owner. Its guideline site gets an address from the name.'}
        </p>
      </div>
      {create.isError && (
        <p role="alert" className="rounded-md bg-danger-wash px-3 py-2 text-sm text-danger">
          {create.error instanceof ApiClientError ? create.error.message : 'The brand could not be created.'}
        </p>
      )}
      {create.isSuccess && (
        <p role="status" className="text-sm text-ok">
          Created <a className="font-semibold underline" href={`/app/brands/${create.data.brand.id}`}>{create.data.brand.name}</a>.
        </p>
      )}
      <button type="submit" className="btn-primary w-full" disabled={create.isPending}>
        {create.isPending ? 'Creating…' : 'Create brand'}
      </button>
    </form>
  );
}

export default function BrandsDashboard() {
  return (
    <QueryRoot>
      <div className="grid gap-8 lg:grid-cols-[1fr_20rem]">
        <BrandsTable />
        <NewBrandForm />
      </div>
    </QueryRoot>
  );
}
