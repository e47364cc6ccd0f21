// Whole-block moves, copies and removals on the top level of the document, as plain ProseMirror transactions.
import type { Editor } from '@tiptap/core';
import { NodeSelection, TextSelection } from '@tiptap/pm/state';
import type { Node as PMNode } from '@tiptap/pm/model';
import { newBlockId } from '@/lib/guideline/ids';

const offsetOf = (doc: PMNode, index: number) => {
  let pos = 0;
  for (let i = 0; i < index; i++) pos += doc.child(i).nodeSize;
  return pos;
};

/** Index of the top-level block at a position (a node view's getPos()), or the one holding the selection. */
export function topLevelIndex(editor: Editor, pos?: number): number {
  const { doc, selection } = editor.state;
  const at = pos ?? selection.from;
  return doc.resolve(Math.min(at, doc.content.size)).index(0);
}

function selectAt(editor: Editor, tr: import('@tiptap/pm/state').Transaction, pos: number) {
  const node = tr.doc.nodeAt(pos);
  if (node?.isAtom) tr.setSelection(NodeSelection.create(tr.doc, pos));
  else tr.setSelection(TextSelection.near(tr.doc.resolve(pos + 1)));
  return tr.scrollIntoView();
}

/** Moves the block one place up (-1) or down (+1); false at either end. */
export function moveBlock(editor: Editor, index: number, direction: -1 | 1): boolean {
  const { doc } = editor.state;
  const target = index + direction;
  if (index < 0 || target < 0 || target >= doc.childCount) return false;
  const node = doc.child(index);
  const from = offsetOf(doc, index);
  const tr = editor.state.tr.delete(from, from + node.nodeSize);
  const insertAt = direction < 0 ? offsetOf(doc, target) : from + doc.child(target).nodeSize;
  tr.insert(insertAt, node);
  editor.view.dispatch(selectAt(editor, tr, insertAt));
  return true;
}

/** Copies the block below itself with a fresh id. */
export function duplicateBlock(editor: Editor, index: number): boolean {
  const { doc } = editor.state;
  if (index < 0 || index >= doc.childCount) return false;
  const node = doc.child(index);
  const copy = node.type.create({ ...node.attrs, id: newBlockId() }, node.content, node.marks);
  const at = offsetOf(doc, index) + node.nodeSize;
  editor.view.dispatch(selectAt(editor, editor.state.tr.insert(at, copy), at));
  return true;
}

/** Removes the block; the last block of a document becomes an empty paragraph. */
export function deleteBlock(editor: Editor, index: number): boolean {
  const { doc, schema } = editor.state;
  if (index < 0 || index >= doc.childCount) return false;
  const from = offsetOf(doc, index);
  const node = doc.child(index);
  const tr = editor.state.tr;
  if (doc.childCount === 1) tr.replaceWith(from, from + node.nodeSize, schema.nodes.paragraph.create());
  else tr.delete(from, from + node.nodeSize);
  const pos = Math.min(from, tr.doc.content.size - tr.doc.lastChild!.nodeSize);
  editor.view.dispatch(selectAt(editor, tr, Math.max(0, pos)));
  editor.view.focus();
  return true;
}

/** Inserts top-level content: in place of an empty paragraph holding the cursor, otherwise after the current block. */
export function insertTopLevel(editor: Editor, json: Record<string, unknown>): boolean {
  const { doc, selection } = editor.state;
  const index = topLevelIndex(editor);
  const current = doc.childCount > 0 ? doc.child(index) : null;
  const node = editor.schema.nodeFromJSON(json);
  const from = offsetOf(doc, index);
  const tr = editor.state.tr;
  let at: number;
  if (current && current.type.name === 'paragraph' && current.content.size === 0 && selection.empty) {
    tr.replaceWith(from, from + current.nodeSize, node);
    at = from;
  } else {
    at = current ? from + current.nodeSize : 0;
    tr.insert(at, node);
  }
  editor.view.dispatch(selectAt(editor, tr, at));
  editor.view.focus();
  return true;
}
