// The guideline editor island: Tiptap blocks rendered live from the identity, an insert menu, an outline, autosave.
import { EditorContent, useEditor, useEditorState, type Editor } from '@tiptap/react';
import { useCallback, useMemo, useRef, useState } from 'react';
import type { GuidelineDoc } from '@/lib/guideline/document';
import { brandStyle } from '@/lib/guideline/identity';
import { isSafeHref } from '@/lib/guideline/links';
import { outline } from '@/lib/guideline/outline';
import type { Identity } from '@/lib/identity/types';
import { statusText, useAutosave, type SaveState } from './autosave';
import { insertTopLevel } from './commands';
import { guidelineExtensions } from './extensions';
import { IdentityContext } from './IdentityContext';
import { InsertMenu } from './InsertMenu';
import { insertItems, type InsertItem } from './insertItems';

export interface GuidelineEditorProps {
  brandId: string;
  initialDoc: GuidelineDoc;
  initialRevision: number;
  identity: Identity;
}

const EMPTY_DOC = { type: 'doc', content: [{ type: 'paragraph' }] };

function StatusLine({ state }: { state: SaveState }) {
  const tone = state.status === 'error' || state.status === 'conflict' ? 'text-danger' : state.status === 'offline' ? 'text-warn' : 'text-ink-soft';
  return (
    <p role="status" aria-live="polite" data-save-status={state.status} className={`text-sm ${tone}`}>
      <span aria-hidden="true" className="mr-1.5">{state.status === 'saved' ? '●' : state.status === 'saving' || state.status === 'pending' ? '○' : '!'}</span>
      {statusText(state)}
      {state.path ? <span className="ml-1 font-mono text-xs">({state.path})</span> : null}
    </p>
  );
}

function ConflictPanel({ state, onKeepMine, onTakeTheirs }: { state: SaveState; onKeepMine: () => void; onTakeTheirs: () => void }) {
  if (!state.conflict) return null;
  const { mine, theirs } = state.conflict;
  // The highlighted answer is the one that keeps what is already saved; replacing it takes a second, deliberate click.
  return (
    <section role="alertdialog" aria-labelledby="conflict-title" className="panel mb-4 border-danger/40 p-4">
      <h2 id="conflict-title" className="text-base font-semibold text-ink">These guidelines were saved elsewhere</h2>
      <p className="hint mt-1">{state.message} Choose which copy to keep; the other is replaced.</p>
      <div className="mt-3 grid gap-3 sm:grid-cols-2">
        <div className="rounded-lg border border-plumb/40 p-3">
          <p className="eyebrow">Saved copy, on the server</p>
          <p className="mt-1 text-sm">{theirs.summary?.text ?? 'Its contents could not be loaded.'}</p>
          <button type="button" className="btn-primary mt-3" onClick={onTakeTheirs} autoFocus>Keep the saved copy</button>
        </div>
        <div className="rounded-lg border border-rule p-3">
          <p className="eyebrow">Unsaved copy, in this browser</p>
          <p className="mt-1 text-sm">{mine.text}</p>
          <button type="button" className="btn-quiet mt-3" onClick={onKeepMine}>Replace it with this browser’s copy</button>
        </div>
      </div>
    </section>
  );
}

function TextTools({ editor }: { editor: Editor }) {
  const marks = useEditorState({ editor, selector: ({ editor: e }) => ({ bold: e.isActive('bold'), italic: e.isActive('italic'), link: e.isActive('link'), canUndo: e.can().undo(), canRedo: e.can().redo() }) });
  const [linking, setLinking] = useState<string | null>(null);
  const applyLink = () => {
    const raw = (linking ?? '').trim();
    const href = /^[a-z][a-z0-9+.-]*:/i.test(raw) ? raw : raw.includes('@') ? `mailto:${raw}` : `https://${raw}`;
    if (raw && isSafeHref(href)) editor.chain().focus().extendMarkRange('link').setLink({ href }).run();
    setLinking(null);
  };
  const btn = (active: boolean) => `rounded px-2 py-1 text-sm font-semibold ${active ? 'bg-plumb-wash text-plumb-deep' : 'text-ink-soft hover:bg-paper'}`;
  return (
    <div role="toolbar" aria-label="Text formatting and history" className="flex flex-wrap items-center gap-1">
      <button type="button" className={btn(false)} aria-label="Undo" disabled={!marks.canUndo} onClick={() => editor.chain().focus().undo().run()}>↶ Undo</button>
      <button type="button" className={btn(false)} aria-label="Redo" disabled={!marks.canRedo} onClick={() => editor.chain().focus().redo().run()}>↷ Redo</button>
      <span className="mx-1 h-5 w-px bg-rule" aria-hidden="true" />
      <button type="button" className={btn(marks.bold)} aria-pressed={marks.bold} aria-label="Bold" onClick={() => editor.chain().focus().toggleBold().run()}><b>B</b></button>
      <button type="button" className={btn(marks.italic)} aria-pressed={marks.italic} aria-label="Italic" onClick={() => editor.chain().focus().toggleItalic().run()}><i>I</i></button>
      {linking === null ? (
        <button type="button" className={btn(marks.link)} aria-pressed={marks.link} aria-label={marks.link ? 'Remove link' : 'Add a link'} onClick={() => (marks.link ? editor.chain().focus().unsetLink().run() : setLinking(''))}>
          {marks.link ? 'Unlink' : 'Link'}
        </button>
      ) : (
        <form className="flex items-center gap-1" onSubmit={(e) => { e.preventDefault(); applyLink(); }}>
          <input autoFocus aria-label="Link address (https:// or e-mail)" className="field w-56 py-1 text-sm" value={linking} onChange={(e) => setLinking(e.target.value)} onKeyDown={(e) => e.key === 'Escape' && setLinking(null)} placeholder="https://… or name@example.com" />
          <button type="submit" className="btn-quiet px-2 py-1">Set</button>
        </form>
      )}
    </div>
  );
}

function Outline({ editor }: { editor: Editor }) {
  const entries = useEditorState({
    editor,
    // Only section headings are read, so a keystroke in a paragraph costs one pass over the top level.
    selector: ({ editor: e }) => {
      const content: { type: string; attrs: Record<string, unknown> }[] = [];
      e.state.doc.forEach((node) => {
        if (node.type.name === 'sectionHeading') content.push({ type: node.type.name, attrs: node.attrs });
      });
      return outline({ content });
    },
    equalityFn: (a, b) => JSON.stringify(a) === JSON.stringify(b),
  });
  const jump = (blockId: string) => {
    let target = -1;
    editor.state.doc.forEach((node, offset) => {
      if (node.attrs.id === blockId) target = offset;
    });
    if (target < 0) return;
    editor.chain().setNodeSelection(target).scrollIntoView().run();
    const dom = editor.view.nodeDOM(target) as HTMLElement | null;
    dom?.scrollIntoView({ block: 'start', behavior: 'smooth' });
    dom?.querySelector<HTMLElement>('input[aria-label="Section title"]')?.focus();
  };
  return (
    <nav aria-label="Sections" className="text-sm">
      <p className="eyebrow mb-2">Sections</p>
      {entries.length === 0 ? <p className="text-ink-soft">Add a Section block to start the contents.</p> : null}
      <ol className="grid gap-0.5">
        {entries.map((e) => (
          <li key={e.blockId}>
            <button type="button" className="w-full rounded px-2 py-1 text-left text-ink-soft hover:bg-paper hover:text-ink" onClick={() => jump(e.blockId)}>
              {e.title || 'Untitled section'}
            </button>
          </li>
        ))}
      </ol>
    </nav>
  );
}

export default function GuidelineEditor({ brandId, initialDoc, initialRevision, identity }: GuidelineEditorProps) {
  const autosave = useAutosave({ brandId, initialRevision, initialDoc });
  const [menu, setMenu] = useState<{ top: number; left: number } | null>(null);
  const editorRef = useRef<Editor | null>(null);
  const addButton = useRef<HTMLButtonElement>(null);
  const items = useMemo(() => insertItems(), []);

  const openMenu = useCallback(() => {
    const editor = editorRef.current;
    if (!editor) return;
    const coords = editor.view.coordsAtPos(editor.state.selection.from);
    setMenu({ top: coords.bottom + 6, left: coords.left });
  }, []);
  const { change, adopt } = autosave;
  const editor = useEditor({
    immediatelyRender: false,
    shouldRerenderOnTransaction: false,
    extensions: guidelineExtensions({ openInsertMenu: () => openMenu() }),
    content: (autosave.restored ?? (initialDoc?.content?.length ? initialDoc : EMPTY_DOC)) as never,
    editorProps: {
      attributes: {
        'aria-label': 'Guideline document',
        'aria-multiline': 'true',
        role: 'textbox',
        // The published reading column's width; rich text styles itself (flow-* classes), so nothing leaks into blocks.
        class: 'mx-auto min-h-[60vh] w-full max-w-guideline py-6 focus:outline-none',
        'data-guideline-column': '',
      },
    },
    onCreate: ({ editor: e }) => {
      editorRef.current = e;
      queueMicrotask(() => adopt(e.getJSON()));
    },
    onUpdate: ({ editor: e }) => change(e.getJSON()),
  });

  const choose = (item: InsertItem) => {
    setMenu(null);
    if (editor) insertTopLevel(editor, item.content(identity));
  };
  const closeMenu = () => {
    setMenu(null);
    editor?.commands.focus();
  };
  const takeTheirs = async () => {
    const doc = await autosave.takeTheirs();
    if (doc && editor) editor.commands.setContent(doc as never, { emitUpdate: false });
  };

  return (
    <IdentityContext.Provider value={identity}>
      <div className="grid gap-6 lg:grid-cols-[14rem_minmax(0,1fr)]">
        <aside className="lg:sticky lg:top-4 lg:self-start">{editor ? <Outline editor={editor} /> : null}</aside>
        <div className="min-w-0">
          <ConflictPanel state={autosave.state} onKeepMine={autosave.keepMine} onTakeTheirs={() => void takeTheirs()} />
          <div className="sticky top-0 z-10 mb-3 flex flex-wrap items-center gap-3 border-b border-rule bg-paper/95 py-2 backdrop-blur">
            <button
              ref={addButton}
              type="button"
              className="btn-primary py-1.5"
              aria-haspopup="dialog"
              aria-expanded={menu !== null}
              aria-keyshortcuts="Control+Alt+B Meta+Alt+B"
              onClick={() => {
                const r = addButton.current!.getBoundingClientRect();
                setMenu({ top: r.bottom + 6, left: r.left });
              }}
            >
              + Add a block
            </button>
            {editor ? <TextTools editor={editor} /> : null}
            <div className="ml-auto">
              <StatusLine state={autosave.state} />
            </div>
          </div>
          <p className="hint mb-2 text-xs">
            Type “/” on an empty line or press Ctrl/⌘ + Alt + B to add a block; Alt + ↑ / ↓ moves the current block.
          </p>
          {/* The page in the brand's body face and text colour, as the published site sets it. */}
          <div className="panel px-5 sm:px-8" style={{ ...brandStyle(identity), fontFamily: 'var(--brand-body-font)', color: 'var(--brand-text)' }}>
            {editor ? <EditorContent editor={editor} /> : <p className="px-2 py-8 text-ink-soft" role="status">Opening the editor…</p>}
          </div>
        </div>
      </div>
      {menu ? <InsertMenu items={items} position={menu} onChoose={choose} onClose={closeMenu} /> : null}
    </IdentityContext.Provider>
  );
}
