// Shown on an empty draft: start the guidelines from a starter template filled with the brand's identity.
import { useState } from 'react';
import { api } from '@/lib/client/api';
import { clearDraft } from '@/lib/guideline/draft';

const CHOICES = [
  {
    template: 'essentials',
    title: 'Essentials',
    summary: 'Logo, clear space, minimum size, misuse, colour, contrast, type and imagery — the pages every client needs.',
  },
  {
    template: 'brand-book',
    title: 'Full brand book',
    summary: 'Everything in Essentials, plus story and values, voice, pattern, applications and downloads.',
  },
] as const;

export default function TemplatePicker({ brandId, revision }: { brandId: string; revision: number }) {
  const [busy, setBusy] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const start = async (template: string) => {
    setBusy(template);
    setError(null);
    try {
      await api(`/api/brands/${brandId}/guideline/template`, { method: 'POST', body: { template, baseRevision: revision } });
      // The blank page this browser kept is replaced by the template on the server: nothing of it is worth restoring.
      clearDraft(window.localStorage, brandId);
      location.reload();
    } catch (err) {
      setError((err as Error).message);
      setBusy(null);
    }
  };
  return (
    <section className="panel p-6" aria-labelledby="start-title">
      <h2 id="start-title" className="text-xl font-bold">Start the guidelines</h2>
      <p className="mt-1 text-ink-soft">Pick a starting structure. It is filled with this brand's colours, logos and typefaces, and every part can be changed, moved or removed.</p>
      {error && <p role="alert" className="mt-4 rounded-md bg-danger-wash px-3 py-2 text-sm text-danger">{error}</p>}
      <div className="mt-5 grid gap-4 md:grid-cols-2">
        {CHOICES.map((c) => (
          <button
            key={c.template}
            type="button"
            disabled={busy !== null}
            onClick={() => start(c.template)}
            className="rounded-lg border border-rule-strong bg-card p-5 text-left hover:border-plumb focus-visible:border-plumb disabled:opacity-60"
          >
            <span className="block text-lg font-semibold">{busy === c.template ? 'Setting up…' : c.title}</span>
            <span className="mt-1 block text-sm text-ink-soft">{c.summary}</span>
          </button>
        ))}
      </div>
      <p className="mt-4 text-sm text-ink-soft">Or start from a blank page: add your first block in the editor below.</p>
    </section>
  );
}
