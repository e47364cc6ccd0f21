// The client's answer on palette routes, opened from the e-mailed link: choose one route, or comment and choose later.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { QueryRoot } from '@/components/app/QueryRoot';
import { When } from '@/components/ui/When';
import { api } from '@/lib/client/api';
import { firstError, maxLengthOf } from '@/lib/client/form';
import { useChange } from '@/lib/client/mutation';
import { CONTRAST_CAUTION } from '@/lib/cautions';
import { routeDecisionBody, type RouteDecision } from '@/lib/palette-routes/schemas';
import type { PublicRouteSet } from '@/lib/palette-routes/views';
import { PaletteRouteCard } from './PaletteRouteCard';

const limits = routeDecisionBody.shape;

export default function RouteChoice(props: { token: string; initial: PublicRouteSet }) {
  return (
    <QueryRoot>
      <Choice {...props} />
    </QueryRoot>
  );
}

function Choice({ token, initial }: { token: string; initial: PublicRouteSet }) {
  const [set, setSet] = useState(initial);
  const [problem, setProblem] = useState<string | null>(null);
  const { register, handleSubmit, watch, setValue } = useForm<RouteDecision>({
    resolver: zodResolver(routeDecisionBody, undefined, { raw: true }),
    defaultValues: { name: initial.contactName ?? '', choice: null, comment: '', routes: initial.routes.map((r) => ({ id: r.id, comment: '' })) },
  });
  const answer = useChange((body: RouteDecision) => api<{ set: PublicRouteSet }>(`/api/palette-routes/${token}/decision`, { method: 'POST', body }), null, {
    onSuccess: (r) => setSet(r.set),
    onError: (e) => setProblem(e.message),
  });
  const choice = watch('choice');
  const open = set.status === 'sent';
  const send = (withChoice: boolean) =>
    handleSubmit(
      (values) => {
        setProblem(null);
        answer.mutate({ ...values, choice: withChoice ? values.choice : null });
      },
      (wrong) => setProblem(firstError(wrong) ?? 'Check your answer.'),
    );
  const chosen = set.routes.find((r) => r.id === set.decision?.chosenRouteId);

  return (
    <div className="mt-10">
      <p className="eyebrow">{set.brandName} · colour routes</p>
      <h1 className="mt-2 text-3xl font-bold">{set.title}</h1>
      {set.intro && <p className="mt-3 max-w-2xl whitespace-pre-line text-ink-soft">{set.intro}</p>}
      {set.decision && (
        <p className="mt-6 rounded-md bg-plumb-wash px-4 py-3 text-plumb-deep" role="status">
          {chosen ? <>You chose “{chosen.name}”</> : <>Your comments were sent</>} ({set.decision.by}, <When value={set.decision.at} as="long" />). Thank you: your designer has been told.
        </p>
      )}
      {open && <p className="mt-4 max-w-2xl text-sm text-ink-soft">Each route below is a complete palette. Under it, every text colour is checked on the route’s grounds, so you can see which pairs will read well. Choose the route that should carry the brand, or leave comments if none is right yet.</p>}
      <form onSubmit={(e) => e.preventDefault()} aria-label="Your answer on the colour routes">
        <div className="mt-8 grid gap-6 lg:grid-cols-2">
          {set.routes.map((route, n) => (
            <PaletteRouteCard key={route.id} route={route} label={`Route ${n + 1} of ${set.routes.length}`} chosen={set.decision?.chosenRouteId === route.id || (open && choice === route.id)}>
              {open && (
                <div className="mt-4 border-t border-rule pt-4">
                  <label className={`flex cursor-pointer items-center gap-2 rounded-md border px-3 py-2 text-sm font-semibold ${choice === route.id ? 'border-plumb bg-plumb-wash text-plumb-deep' : 'border-rule-strong text-ink'}`}>
                    <input type="radio" name="choice" checked={choice === route.id} onChange={() => setValue('choice', route.id)} />
                    Choose “{route.name}”
                  </label>
                  <input type="hidden" {...register(`routes.${n}.id` as const)} />
                  <label className="label mt-3" htmlFor={`route-note-${route.id}`}>A note on this route (optional)</label>
                  <input id={`route-note-${route.id}`} className="field text-sm" maxLength={1000} {...register(`routes.${n}.comment` as const)} />
                </div>
              )}
            </PaletteRouteCard>
          ))}
        </div>
        <p className="mt-4 max-w-3xl text-xs text-ink-soft">{CONTRAST_CAUTION}</p>
        {open && (
          <section className="panel mt-8 px-6 py-6" aria-labelledby="answer-title">
            <h2 id="answer-title" className="text-xl font-bold">Your answer</h2>
            <div className="mt-4 max-w-sm">
              <label htmlFor="answer-name" className="label">Your name</label>
              <input id="answer-name" className="field" maxLength={maxLengthOf(limits.name)} {...register('name')} />
            </div>
            <label htmlFor="answer-comment" className="label mt-4">Comments on the routes as a whole</label>
            <textarea id="answer-comment" className="field min-h-24" maxLength={maxLengthOf(limits.comment)} {...register('comment')} />
            {problem && <p className="error-text" role="alert">{problem}</p>}
            <div className="mt-5 flex flex-wrap gap-3">
              <button type="button" className="btn-primary" disabled={answer.isPending || !choice} onClick={() => void send(true)()}>
                {choice ? `Go with “${set.routes.find((r) => r.id === choice)?.name ?? ''}”` : 'Pick a route above'}
              </button>
              <button type="button" className="btn-quiet" disabled={answer.isPending} onClick={() => void send(false)()}>Send comments, choose later</button>
            </div>
            <p className="mt-3 text-xs text-ink-soft">You can answer once on this link. Your designer can send a new link if you change your mind.</p>
          </section>
        )}
      </form>
    </div>
  );
}
