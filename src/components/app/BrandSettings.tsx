// A brand's own settings: its name, its public address (the old one keeps redirecting), and deletion for owners.
import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { brandName, brandSlug } from '@/lib/brands/schemas';
import { api } from '@/lib/client/api';
import { QueryRoot } from './QueryRoot';

interface Props {
  brandId: string;
  name: string;
  slug: string;
  origin: string;
  canDelete: boolean;
  published: boolean;
}

// The same limits the API enforces (src/lib/brands/schemas.ts), shown while typing.
const settingsForm = z.object({ name: brandName, slug: brandSlug });
type SettingsForm = z.infer<typeof settingsForm>;

function Settings({ brandId, name, slug, origin, canDelete, published }: Props) {
  const [current, setCurrent] = useState({ name, slug });
  const [notice, setNotice] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  const form = useForm<SettingsForm>({ resolver: zodResolver(settingsForm), defaultValues: current });
  const save = useMutation({
    mutationFn: (values: SettingsForm) => {
      const changes: Partial<SettingsForm> = {};
      if (values.name !== current.name) changes.name = values.name;
      if (values.slug !== current.slug) changes.slug = values.slug;
      return api<{ brand: { name: string; slug: string } }>(`/api/brands/${brandId}`, { method: 'PATCH', body: changes });
    },
    onSuccess: ({ brand }) => {
      const moved = brand.slug !== current.slug;
      setNotice({ kind: 'ok', text: moved ? `Saved. Links to /b/${current.slug} now lead to /b/${brand.slug}.` : 'Saved.' });
      setCurrent(brand);
      form.reset(brand);
    },
    onError: (e: Error) => setNotice({ kind: 'error', text: e.message }),
  });
  const slugNow = form.watch('slug');
  const nameNow = form.watch('name');
  const changed = nameNow !== current.name || slugNow !== current.slug;
  const errors = form.formState.errors;

  return (
    <div className="px-6 py-5">
      {notice && (
        <p role={notice.kind === 'error' ? 'alert' : 'status'} className={`mb-4 rounded-md px-3 py-2 text-sm ${notice.kind === 'error' ? 'bg-danger-wash text-danger' : 'bg-plumb-wash text-plumb-deep'}`}>
          {notice.text}
        </p>
      )}
      <form className="grid gap-4 md:grid-cols-2" aria-label="Brand name and address" onSubmit={form.handleSubmit((v) => { setNotice(null); save.mutate(v); }, () => setNotice(null))} noValidate>
        <div>
          <label className="label" htmlFor="brand-name">Brand name</label>
          <input id="brand-name" className="field" {...form.register('name')} aria-invalid={!!errors.name} aria-describedby={errors.name ? 'brand-name-error' : undefined} />
          {errors.name && <p id="brand-name-error" className="mt-1 text-sm text-danger">{errors.name.message}</p>}
        </div>
        <div>
          <label className="label" htmlFor="brand-slug">Public address</label>
          <div className="flex items-center gap-1">
            <span className="shrink-0 font-mono text-sm text-ink-soft">{origin}/b/</span>
            <input id="brand-slug" className="field font-mono" {...form.register('slug')} aria-invalid={!!errors.slug} aria-describedby="brand-slug-help" />
          </div>
          <p id="brand-slug-help" className={`mt-1 text-sm ${errors.slug ? 'text-danger' : 'text-ink-soft'}`}>
            {errors.slug?.message ?? (slugNow !== current.slug && published ? `Published links to /b/${current.slug} will redirect to the new address.` : 'Lower-case letters, digits and hyphens.')}
          </p>
        </div>
        <div className="md:col-span-2">
          <button className="btn-primary" disabled={!changed || save.isPending}>{save.isPending ? 'Saving…' : 'Save name and address'}</button>
        </div>
      </form>
      {canDelete && <DeleteBrand brandId={brandId} name={current.name} />}
    </div>
  );
}

function DeleteBrand({ brandId, name }: { brandId: string; name: string }) {
  const [open, setOpen] = useState(false);
  const [typed, setTyped] = useState('');
  const [error, setError] = useState<string | null>(null);
  const remove = useMutation({
    mutationFn: () => api(`/api/brands/${brandId}`, { method: 'DELETE' }),
    onSuccess: () => location.assign('/app?deleted=1'),
    onError: (e: Error) => setError(e.message),
  });
  return (
    <section className="mt-8 rounded-lg border border-danger/40 p-4" aria-labelledby="delete-brand-title">
      <h3 id="delete-brand-title" className="font-semibold text-danger">Delete this brand</h3>
      <p className="mt-1 text-sm text-ink-soft">
        Deletes its identity, guidelines, every published version, its share links, files and downloads. People with links
        lose access at once. This cannot be undone; the audit trail keeps a record that it happened.
      </p>
      {!open ? (
        <button type="button" className="btn-danger mt-3" onClick={() => setOpen(true)}>Delete this brand…</button>
      ) : (
        <form className="mt-3 flex flex-wrap items-end gap-3" onSubmit={(e) => { e.preventDefault(); setError(null); remove.mutate(); }}>
          <div className="min-w-64 flex-1">
            <label className="label" htmlFor="delete-confirm">Type the brand’s name, <strong>{name}</strong>, to confirm</label>
            <input id="delete-confirm" className="field" autoComplete="off" value={typed} onChange={(e) => setTyped(e.target.value)} />
          </div>
          <button className="btn-danger" disabled={typed.trim() !== name || remove.isPending}>{remove.isPending ? 'Deleting…' : 'Delete for good'}</button>
          <button type="button" className="btn-quiet" onClick={() => { setOpen(false); setTyped(''); }}>Keep the brand</button>
          {error && <p role="alert" className="w-full text-sm text-danger">{error}</p>}
        </form>
      )}
    </section>
  );
}

export default function BrandSettings(props: Props) {
  return (
    <QueryRoot>
      <Settings {...props} />
    </QueryRoot>
  );
}
