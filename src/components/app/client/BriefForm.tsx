// The client's side of a brief: every question, saved as they type (after a short pause), then submitted.
import { useEffect, useRef, useState } from 'react';
import { ApiClientError, api } from '@/lib/client/api';
import { ANSWER_LIMITS, type Question } from '@/lib/briefs/questionnaire';
import type { PublicBrief } from '@/lib/briefs/views';
import { When } from '@/components/ui/When';
import { formatDateTime, formatTime, SITE_LOCALE } from '@/lib/format';

type Answers = Record<string, string | string[]>;
type SaveState = { kind: 'idle' | 'saving' | 'saved' | 'error'; text: string };

const AUTOSAVE_PAUSE_MS = 800;

function Field({ q, value, onChange, disabled, error }: { q: Question; value: string | string[] | undefined; onChange: (v: string | string[]) => void; disabled: boolean; error?: string }) {
  const id = `q-${q.id}`;
  const described = [q.help ? `${id}-help` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;
  const label = (
    <label htmlFor={q.kind === 'choice' ? undefined : id} className="label" id={`${id}-label`}>
      {q.label}
      {q.required && <span className="ml-1 text-danger" aria-hidden="true">*</span>}
      {q.required && <span className="sr-only"> (required)</span>}
    </label>
  );
  let control;
  if (q.kind === 'choice') {
    const chosen = Array.isArray(value) ? value : value ? [value] : [];
    control = (
      <div role={q.multiple ? 'group' : 'radiogroup'} aria-labelledby={`${id}-label`} aria-describedby={described} className="mt-1 grid gap-2 sm:grid-cols-2">
        {q.options!.map((o) => (
          <label key={o} className="flex items-center gap-2 rounded-md border border-rule px-3 py-2 text-sm">
            <input
              type={q.multiple ? 'checkbox' : 'radio'}
              name={id}
              disabled={disabled}
              checked={chosen.includes(o)}
              onChange={(e) => onChange(q.multiple ? (e.target.checked ? [...chosen, o] : chosen.filter((c) => c !== o)) : o)}
            />
            {o}
          </label>
        ))}
      </div>
    );
  } else if (q.kind === 'list') {
    const text = Array.isArray(value) ? value.join('\n') : (value ?? '');
    control = <textarea id={id} className="field min-h-28" disabled={disabled} value={text} aria-describedby={described} aria-invalid={!!error} onChange={(e) => onChange(e.target.value.split('\n'))} />;
  } else {
    const max = ANSWER_LIMITS[q.kind];
    const text = typeof value === 'string' ? value : '';
    control =
      q.kind === 'long' ? (
        <textarea id={id} className="field min-h-32" disabled={disabled} value={text} maxLength={max} aria-describedby={described} aria-invalid={!!error} onChange={(e) => onChange(e.target.value)} />
      ) : (
        <input id={id} className="field" disabled={disabled} value={text} maxLength={max} aria-describedby={described} aria-invalid={!!error} onChange={(e) => onChange(e.target.value)} />
      );
  }
  return (
    <div className="py-4">
      {label}
      {q.help && <p id={`${id}-help`} className="mb-2 text-sm text-ink-soft">{q.help}</p>}
      {control}
      {error && <p id={`${id}-error`} className="error-text">{error}</p>}
    </div>
  );
}

export default function BriefForm({ token, brief }: { token: string; brief: PublicBrief }) {
  const [answers, setAnswers] = useState<Answers>(brief.answers);
  const [submittedAt, setSubmittedAt] = useState(brief.submittedAt);
  const [save, setSave] = useState<SaveState>({ kind: 'idle', text: brief.savedAt ? `Last saved ${formatDateTime(brief.savedAt, SITE_LOCALE)}` : 'Answers are saved as you type.' });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [submitError, setSubmitError] = useState<string | null>(null);
  const pending = useRef<Answers>({});
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const url = `/api/briefs/${token}`;

  const flush = async () => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    const patch = pending.current;
    if (!Object.keys(patch).length) return true;
    pending.current = {};
    setSave({ kind: 'saving', text: 'Saving…' });
    try {
      await api(url, { method: 'PUT', body: { answers: patch } });
      setSave({ kind: 'saved', text: `Saved at ${formatTime(Date.now())}` });
      setErrors((e) => Object.fromEntries(Object.entries(e).filter(([k]) => !(k in patch))));
      return true;
    } catch (err) {
      // Keep what was typed: it is sent again with the next change or on submit.
      pending.current = { ...patch, ...pending.current };
      const e = err as ApiClientError;
      const details = (e.details as { path: string; message: string }[] | undefined) ?? [];
      const byField: Record<string, string> = {};
      for (const d of details) byField[d.path.replace(/^answers\./, '').split('.')[0]] = d.message;
      setErrors((prev) => ({ ...prev, ...byField }));
      setSave({ kind: 'error', text: `Not saved: ${e.message}` });
      return false;
    }
  };

  useEffect(() => {
    const beforeUnload = (e: BeforeUnloadEvent) => {
      if (Object.keys(pending.current).length) e.preventDefault();
    };
    addEventListener('beforeunload', beforeUnload);
    return () => removeEventListener('beforeunload', beforeUnload);
  }, []);

  const change = (id: string, value: string | string[]) => {
    setAnswers((a) => ({ ...a, [id]: value }));
    pending.current[id] = value;
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => void flush(), AUTOSAVE_PAUSE_MS);
  };

  const submit = async () => {
    setSubmitError(null);
    if (!(await flush())) return setSubmitError('Some answers could not be saved; see the messages beside them.');
    try {
      const r = await api<{ submittedAt: string }>(`${url}/submit`, { method: 'POST', body: {} });
      setSubmittedAt(r.submittedAt);
    } catch (err) {
      const e = err as ApiClientError;
      const details = (e.details as { path: string; message: string }[] | undefined) ?? [];
      setErrors(Object.fromEntries(details.map((d) => [d.path, d.message])));
      setSubmitError(e.message);
    }
  };

  const done = !!submittedAt;
  return (
    <div className="mt-10">
      <p className="eyebrow">{brief.brandName}</p>
      <h1 className="mt-2 text-3xl font-bold">{brief.title}</h1>
      <p className="mt-3 max-w-2xl text-ink-soft">Hello {brief.contactName}. {brief.questionnaire.intro}</p>
      {done ? (
        <p className="mt-6 rounded-md bg-plumb-wash px-4 py-3 text-plumb-deep" role="status">
          Thank you — your answers were sent on <When value={submittedAt!} as="long" />. They are shown below for your records.
        </p>
      ) : (
        <p className={`sticky top-0 z-10 mt-6 rounded-md px-4 py-2 text-sm ${save.kind === 'error' ? 'bg-danger-wash text-danger' : 'bg-paper text-ink-soft'}`} role="status" aria-live="polite">
          {save.text}
        </p>
      )}
      {brief.questionnaire.sections.map((s) => (
        <section key={s.title} className="panel mt-6 px-6 py-4" aria-labelledby={`sec-${s.title}`}>
          <h2 id={`sec-${s.title}`} className="pt-2 text-xl font-bold">{s.title}</h2>
          <div className="divide-y divide-rule">
            {s.questions.map((q) => (
              <Field key={q.id} q={q} value={answers[q.id]} disabled={done} error={errors[q.id]} onChange={(v) => change(q.id, v)} />
            ))}
          </div>
        </section>
      ))}
      {!done && (
        <div className="mt-8 flex flex-wrap items-center gap-4">
          <button type="button" className="btn-primary" onClick={() => void submit()}>Send my answers</button>
          <span className="text-sm text-ink-soft">You can leave and come back to this link until you send. Questions marked * are needed.</span>
        </div>
      )}
      {submitError && <p className="error-text" role="alert">{submitError}</p>}
    </div>
  );
}
