// Gives every top-level block a stable id (kept across edits, fresh on copies), which review comments anchor to.
import { Extension } from '@tiptap/core';
import { Plugin, PluginKey, type EditorState, type Transaction } from '@tiptap/pm/state';
import { newBlockId } from '@/lib/guideline/ids';
import { RICH_TEXT_TYPES } from '@/lib/guideline/richText';

const key = new PluginKey('blockIds');

/** A transaction that fills missing or repeated top-level ids, or null when all are fine. */
export function assignBlockIds(state: EditorState): Transaction | null {
  const seen = new Set<string>();
  let tr: Transaction | null = null;
  state.doc.forEach((node, offset) => {
    if (!('id' in node.attrs)) return;
    const id = node.attrs.id;
    if (typeof id === 'string' && id && !seen.has(id)) {
      seen.add(id);
      return;
    }
    const fresh = newBlockId();
    seen.add(fresh);
    tr ??= state.tr;
    tr.setNodeMarkup(offset, undefined, { ...node.attrs, id: fresh });
  });
  if (tr) (tr as Transaction).setMeta('addToHistory', false).setMeta(key, true);
  return tr;
}

export const BlockIds = Extension.create({
  name: 'blockIds',
  addGlobalAttributes() {
    return [
      {
        types: [...RICH_TEXT_TYPES],
        attributes: {
          id: {
            default: null,
            keepOnSplit: false,
            parseHTML: (el) => el.getAttribute('data-block-id'),
            renderHTML: (a) => (a.id ? { 'data-block-id': a.id } : {}),
          },
        },
      },
    ];
  },
  addProseMirrorPlugins() {
    return [new Plugin({ key, appendTransaction: (trs, _old, state) => (trs.some((t) => t.docChanged) ? assignBlockIds(state) : null) })];
  },
  onCreate() {
    const tr = assignBlockIds(this.editor.state);
    if (tr) this.editor.view.dispatch(tr);
  },
});
