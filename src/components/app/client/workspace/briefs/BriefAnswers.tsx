// One brief's answers, question by question, as the client left them.
import { useBriefAnswers } from './briefs.queries';

export function BriefAnswers({ brandId, briefId }: { brandId: string; briefId: string }) {
  const q = useBriefAnswers(brandId, briefId);
  if (q.isPending) return <p className="text-ink-soft" role="status">Loading answers…</p>;
  if (q.isError) return <p className="text-danger" role="alert">{q.error.message}</p>;
  return (
    <div className="mt-3 space-y-4">
      {q.data.questionnaire.sections.map((s) => (
        <div key={s.title}>
          <h4 className="eyebrow">{s.title}</h4>
          <dl className="mt-2 space-y-2">
            {s.questions.map((x) => {
              const v = q.data.answers[x.id];
              const text = Array.isArray(v) ? v.filter((l) => l.trim()).join(' · ') : v;
              return (
                <div key={x.id}>
                  <dt className="text-sm font-semibold">{x.label}</dt>
                  <dd className="whitespace-pre-line text-sm text-ink-soft">{text?.trim() ? text : <em>No answer yet</em>}</dd>
                </div>
              );
            })}
          </dl>
        </div>
      ))}
    </div>
  );
}
