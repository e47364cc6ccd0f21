// Settings of the pattern: a linked shelf pattern, or the block's own mark, layout, size, gap, turn, seed, colours and
// strength with the tile's export and a way onto the shelf.
import { useState } from 'react';
import type { ReactNodeViewProps } from '@tiptap/react';
import { attrsFromPatternSettings, blockPatternSettings, drawnPatternSettings, type PatternAttrs } from './definition';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { ColorSelect, LogoSelect, NumberInput, Select } from '@/components/editor/blocks/controls';
import { useIdentity } from '@/components/editor/IdentityContext';
import { api } from '@/lib/client/api';
import { PATTERN_LAYOUT_LABELS, PATTERN_LAYOUTS, patternQuery, type PatternLayout, type PatternSettings } from '@/lib/pattern/layout';

const layoutOptions = PATTERN_LAYOUTS.map((value) => ({ value, label: PATTERN_LAYOUT_LABELS[value] }));

/** Download links for one seamless tile, and a button that keeps it on the asset shelf with its settings. */
function TileExport({ brandId, settings }: { brandId: string; settings: PatternSettings }) {
  const [state, setState] = useState<{ busy: boolean; message: string | null; failed: boolean }>({ busy: false, message: null, failed: false });
  const base = `/api/brands/${encodeURIComponent(brandId)}/patterns?${patternQuery(settings).toString()}`;
  const save = async () => {
    setState({ busy: true, message: null, failed: false });
    try {
      const saved = await api<{ asset: { name: string }; duplicate: boolean }>(`/api/brands/${encodeURIComponent(brandId)}/patterns`, { method: 'POST', body: { settings } });
      setState({ busy: false, failed: false, message: saved.duplicate ? `This tile is already on the shelf as “${saved.asset.name}”.` : `Added to the shelf as a draft: “${saved.asset.name}”.` });
    } catch (err) {
      setState({ busy: false, failed: true, message: (err as Error).message });
    }
  };
  return (
    <div className="sm:col-span-2 flex flex-wrap items-center gap-3 border-t border-rule pt-3 text-sm">
      <span className="text-ink-soft">One seamless tile:</span>
      <a className="font-semibold underline" href={`${base}&format=svg&download=1`}>SVG</a>
      <a className="font-semibold underline" href={`${base}&format=png&ratio=2&download=1`}>PNG (2×)</a>
      <button type="button" className="btn-quiet" disabled={state.busy} onClick={save}>{state.busy ? 'Adding…' : 'Add to shelf'}</button>
      {state.message ? <p role={state.failed ? 'alert' : 'status'} className={state.failed ? "w-full error-text" : "w-full hint"}>{state.message}</p> : null}
    </div>
  );
}

interface ShelfPattern {
  id: string;
  name: string;
}

/** Link an approved shelf pattern: the block keeps its id and draws whatever that pattern is, so the two never drift apart. */
function FromShelf({ brandId, onPick }: { brandId: string; onPick: (patternId: string) => void }) {
  const [list, setList] = useState<{ loading: boolean; patterns: ShelfPattern[] | null; problem: string | null }>({ loading: false, patterns: null, problem: null });
  const load = async () => {
    setList({ loading: true, patterns: null, problem: null });
    try {
      const answer = await api<{ assets: ShelfPattern[] }>(`/api/brands/${encodeURIComponent(brandId)}/assets?kind=pattern&state=approved`);
      setList({ loading: false, patterns: answer.assets, problem: null });
    } catch (err) {
      setList({ loading: false, patterns: null, problem: (err as Error).message });
    }
  };
  if (!list.patterns) {
    return (
      <div className="sm:col-span-2 text-sm">
        <button type="button" className="btn-quiet" disabled={list.loading} onClick={load}>{list.loading ? 'Loading…' : 'Link a shelf pattern'}</button>
        {list.problem ? <p role="alert" className="error-text">{list.problem}</p> : null}
      </div>
    );
  }
  if (!list.patterns.length) return <p className="sm:col-span-2 hint">No approved patterns on the shelf yet: set this one up, “Add to shelf”, and approve it on the shelf.</p>;
  return (
    <Select<string>
      label="Shelf pattern"
      value=""
      options={[{ value: '', label: 'Choose an approved pattern…' }, ...list.patterns.map((p) => ({ value: p.id, label: p.name }))]}
      onChange={(id) => {
        if (id) onPick(id);
      }}
      hint="The block shows that pattern as the shelf keeps it."
    />
  );
}

/** The block while it links a shelf pattern: its name, and a way back to settings of its own (starting from the pattern's). */
function Linked({ linked, settings, onUnlink }: { linked: { name: string } | null; settings: PatternSettings | null; onUnlink: (attrs: Partial<PatternAttrs>) => void }) {
  return (
    <div className="sm:col-span-2 grid gap-2 text-sm" data-linked-pattern>
      <p>
        {linked ? <>Shows the shelf pattern <strong>{linked.name}</strong>; change it on the shelf or in its own block.</> : <span className="error-text">The linked shelf pattern cannot be drawn: it is not approved, or its mark or colours have left the identity.</span>}
      </p>
      <button type="button" className="btn-quiet justify-self-start" onClick={() => onUnlink({ patternId: null, ...(settings ? attrsFromPatternSettings(settings) : {}) })}>
        Unlink and set it up here
      </button>
    </div>
  );
}

export function Settings(props: ReactNodeViewProps) {
  const identity = useIdentity();
  const a = props.node.attrs as PatternAttrs;
  const set = (patch: Partial<PatternAttrs>) => props.updateAttributes(patch);
  const drawn = drawnPatternSettings(a, identity);
  if (a.patternId) {
    return (
      <BlockFrame
        props={props}
        startOpen={drawn.missing}
        settings={
          <div className="grid gap-4 sm:grid-cols-2">
            <Linked linked={drawn.linked} settings={drawn.settings} onUnlink={set} />
            <NumberInput label="Height" unit="px" value={a.height} min={80} max={600} step={10} onChange={(height) => set({ height })} />
          </div>
        }
      />
    );
  }
  const settings = blockPatternSettings(a);
  return (
    <BlockFrame
      props={props}
      startOpen={!a.logoId}
      settings={
        <div className="grid gap-4 sm:grid-cols-2">
          <LogoSelect label="Mark" identity={identity} value={a.logoId} onChange={(logoId) => set({ logoId })} />
          <Select<PatternLayout> label="Layout" value={a.layout} options={layoutOptions} onChange={(layout) => set({ layout })} />
          <ColorSelect label="Mark colour" identity={identity} value={a.markColorId} onChange={(markColorId) => set({ markColorId })} noneLabel="The primary colour" />
          <ColorSelect label="Ground colour" identity={identity} value={a.backgroundColorId} onChange={(backgroundColorId) => set({ backgroundColorId })} noneLabel="The background colour" />
          <NumberInput label="Mark size" unit="px" value={a.scale} min={8} max={160} step={1} onChange={(scale) => set({ scale })} />
          <NumberInput label="Gap" unit="× mark size" value={a.spacing} min={0.25} max={8} step={0.25} onChange={(spacing) => set({ spacing })} />
          <NumberInput label="Turn of each mark" unit="°" value={a.rotation} min={-180} max={180} step={1} onChange={(rotation) => set({ rotation })} />
          {a.layout === 'scatter' ? (
            <div className="text-sm">
              <p className="label">Scatter</p>
              {/* A new seed draws a new arrangement; the same seed always draws the same one. */}
              <button type="button" className="btn-quiet" onClick={() => set({ seed: Math.floor(Math.random() * 2 ** 31) })}>Scatter again</button>
              <p className="hint">Arrangement no. {a.seed}</p>
            </div>
          ) : null}
          <NumberInput label="Strength" unit="opacity" value={a.opacity} min={0.05} max={1} step={0.01} onChange={(opacity) => set({ opacity })} />
          <NumberInput label="Height" unit="px" value={a.height} min={80} max={600} step={10} onChange={(height) => set({ height })} />
          <FromShelf brandId={identity.brand.id} onPick={(patternId) => set({ patternId })} />
          {settings ? <TileExport brandId={identity.brand.id} settings={settings} /> : null}
        </div>
      }
    />
  );
}
