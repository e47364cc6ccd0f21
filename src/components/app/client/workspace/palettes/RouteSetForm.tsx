// Compose a set of two to four palette routes (or change one): each route a name, a reason and 2–12 colours with roles.
import { zodResolver } from '@hookform/resolvers/zod';
import { useFieldArray, useForm, type Control, type UseFormRegister } from 'react-hook-form';
import { firstError, maxLengthOf } from '@/lib/client/form';
import { COLOR_ROLES } from '@/lib/identity/types';
import { createRouteSetBody, MAX_ROUTE_COLORS, MAX_ROUTES, MIN_ROUTE_COLORS, MIN_ROUTES, routeColorSchema, routeSchema } from '@/lib/palette-routes/schemas';
import type { RouteSetView } from '@/lib/palette-routes/views';
import { failed, type SetNote } from '../chrome';
import { useCreateSet, useUpdateSet, type NewSet } from './palettes.queries';

const blankRoute = (): NewSet['routes'][number] => ({
  name: '',
  rationale: '',
  colors: [
    { name: '', value: '', role: 'primary' },
    { name: '', value: '', role: 'background' },
    { name: '', value: '', role: 'text' },
  ],
});

const fromView = (set: RouteSetView): NewSet => ({
  title: set.title,
  intro: set.intro,
  routes: set.routes.map((r) => ({ name: r.name, rationale: r.rationale, colors: r.colors.map((c) => ({ name: c.name, value: c.value, role: (c.role as (typeof COLOR_ROLES)[number] | null) ?? null })) })),
});

/** A new set when `set` is missing, otherwise the routes of `set` to change. */
export function RouteSetForm({ brandId, set, onNote, onDone }: { brandId: string; set?: RouteSetView; onNote: SetNote; onDone?: () => void }) {
  const { register, control, handleSubmit, reset } = useForm<NewSet>({
    resolver: zodResolver(createRouteSetBody, undefined, { raw: true }),
    defaultValues: set ? fromView(set) : { title: '', intro: '', routes: [blankRoute(), blankRoute()] },
  });
  const routes = useFieldArray({ control, name: 'routes' });
  const done = (text: string) => () => {
    onNote({ kind: 'ok', text });
    if (!set) reset({ title: '', intro: '', routes: [blankRoute(), blankRoute()] });
    onDone?.();
  };
  const create = useCreateSet(brandId, { onSuccess: done('The routes are saved. Check their contrast, then send them to the client.'), onError: failed(onNote) });
  const update = useUpdateSet(brandId, set?.id ?? '', { onSuccess: done('The routes are saved.'), onError: failed(onNote) });
  const busy = create.isPending || update.isPending;
  const submit = handleSubmit(
    (values) => {
      onNote(null);
      (set ? update : create).mutate(values);
    },
    (wrong) => onNote({ kind: 'error', text: firstError(wrong) ?? 'Check the routes.' }),
  );
  const key = set?.id ?? 'new';
  return (
    <form className="mt-4 rounded-lg bg-paper p-4" aria-label={set ? `Change ${set.title}` : 'Prepare palette routes'} onSubmit={submit}>
      <div className="grid gap-3 md:grid-cols-2">
        <div><label className="label" htmlFor={`rs-title-${key}`}>Title of the set</label><input id={`rs-title-${key}`} className="field" maxLength={maxLengthOf(createRouteSetBody.shape.title)} {...register('title')} /></div>
        <div><label className="label" htmlFor={`rs-intro-${key}`}>A word to the client (optional)</label><input id={`rs-intro-${key}`} className="field" maxLength={maxLengthOf(createRouteSetBody.shape.intro)} {...register('intro')} /></div>
      </div>
      <div className="mt-4 grid gap-4 xl:grid-cols-2">
        {routes.fields.map((field, n) => (
          <fieldset key={field.id} className="rounded-md border border-rule bg-card p-3">
            <legend className="px-1 text-sm font-semibold">Route {n + 1}</legend>
            <div className="grid gap-2">
              <div><label className="label" htmlFor={`r-name-${key}-${n}`}>Route name</label><input id={`r-name-${key}-${n}`} className="field" maxLength={maxLengthOf(routeSchema.shape.name)} {...register(`routes.${n}.name` as const)} /></div>
              <div><label className="label" htmlFor={`r-why-${key}-${n}`}>Why this route</label><textarea id={`r-why-${key}-${n}`} className="field min-h-16" maxLength={maxLengthOf(routeSchema.shape.rationale)} {...register(`routes.${n}.rationale` as const)} /></div>
            </div>
            <RouteColors control={control} register={register} route={n} />
            {routes.fields.length > MIN_ROUTES && <button type="button" className="mt-2 text-sm text-danger" onClick={() => routes.remove(n)}>Remove route {n + 1}</button>}
          </fieldset>
        ))}
      </div>
      <div className="mt-4 flex flex-wrap gap-3">
        {routes.fields.length < MAX_ROUTES && <button type="button" className="btn-quiet" onClick={() => routes.append(blankRoute())}>Add a route</button>}
        <button className="btn-primary" disabled={busy}>{set ? 'Save the routes' : 'Save as a new set'}</button>
      </div>
    </form>
  );
}

function RouteColors({ control, register, route }: { control: Control<NewSet>; register: UseFormRegister<NewSet>; route: number }) {
  const colors = useFieldArray({ control, name: `routes.${route}.colors` as const });
  return (
    <div className="mt-3">
      <p className="label">Colours ({MIN_ROUTE_COLORS}–{MAX_ROUTE_COLORS}); mark the page colour “background” so the contrast check reads text on it</p>
      <ul className="grid gap-1.5">
        {colors.fields.map((c, i) => (
          <li key={c.id} className="grid grid-cols-[1fr_1fr_auto_auto] items-center gap-1.5">
            <input aria-label={`Route ${route + 1}, colour ${i + 1}: name`} placeholder="Name" className="field py-1 text-sm" maxLength={maxLengthOf(routeColorSchema.shape.name)} {...register(`routes.${route}.colors.${i}.name` as const)} />
            <input aria-label={`Route ${route + 1}, colour ${i + 1}: value`} placeholder="#2f5d50 or oklch(…)" className="field py-1 font-mono text-sm" maxLength={maxLengthOf(routeColorSchema.shape.value)} {...register(`routes.${route}.colors.${i}.value` as const)} />
            <select aria-label={`Route ${route + 1}, colour ${i + 1}: role`} className="field py-1 text-sm" {...register(`routes.${route}.colors.${i}.role` as const, { setValueAs: (v) => (v === '' ? null : v) })}>
              <option value="">no role</option>
              {COLOR_ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
            </select>
            <button type="button" className="px-1 text-sm text-ink-faint hover:text-danger disabled:opacity-40" disabled={colors.fields.length <= MIN_ROUTE_COLORS} aria-label={`Remove colour ${i + 1} of route ${route + 1}`} onClick={() => colors.remove(i)}>×</button>
          </li>
        ))}
      </ul>
      {colors.fields.length < MAX_ROUTE_COLORS && <button type="button" className="mt-1.5 text-sm text-plumb" onClick={() => colors.append({ name: '', value: '', role: null })}>Add a colour</button>}
    </div>
  );
}
