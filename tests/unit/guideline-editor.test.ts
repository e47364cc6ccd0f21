// @vitest-environment jsdom
// The editor's schema against the shared validator: what Tiptap produces must pass the same checks the server runs.
import { readFileSync } from 'node:fs';
import { Editor } from '@tiptap/core';
import { afterEach, describe, expect, test } from 'vitest';
import { BLOCKS } from '@/blocks';
import { validateGuideline } from '@/lib/guideline/document';
import { instantiateTemplate } from '@/lib/guideline/templates';
import type { Identity } from '@/lib/identity/types';
import { deleteBlock, duplicateBlock, insertTopLevel, moveBlock } from '@/components/editor/commands';
import { guidelineExtensions } from '@/components/editor/extensions';
import { filterItems, insertItems } from '@/components/editor/insertItems';

const identity = JSON.parse(readFileSync('tests/fixtures/identity-larchmere.json', 'utf8')) as Identity;
const brandBook = JSON.parse(readFileSync('templates/guidelines/brand-book.json', 'utf8'));

let editor: Editor | undefined;
const open = (content: unknown, opts: { openInsertMenu?: () => void } = {}) => {
  editor = new Editor({ element: document.createElement('div'), extensions: guidelineExtensions(opts), content: content as never });
  return editor;
};
/** Tiptap emits "create" (where missing ids are filled) just after mounting. */
const created = (e: Editor) => new Promise<Editor>((resolve) => e.on('create', () => resolve(e)));
afterEach(() => editor?.destroy());
const ids = (e: Editor) => (e.getJSON().content ?? []).map((n) => n.attrs?.id as string);
const types = (e: Editor) => (e.getJSON().content ?? []).map((n) => n.type);

describe('editor schema', () => {
  test('a template loaded into the editor comes back out valid, with the same blocks, ids and attributes', async () => {
    const doc = instantiateTemplate(brandBook, identity);
    const e = await created(open(doc));
    const out = e.getJSON();
    const result = validateGuideline(out);
    expect(result.ok ? 'valid' : result.error).toBe('valid');
    // Beyond the template's blocks the editor adds only a trailing paragraph (and null ids on nested paragraphs).
    expect(out.content!.length - doc.content.length).toBeLessThanOrEqual(1);
    doc.content.forEach((node, i) => {
      expect(out.content![i].type).toBe(node.type);
      if (BLOCKS.some((b) => b.type === node.type)) expect(out.content![i].attrs).toEqual(node.attrs);
      else expect(out.content![i].attrs?.id).toBe((node.attrs as { id: string }).id);
    });
  });

  test('every registry block has a node whose attribute defaults match the schema defaults', () => {
    const e = open({ type: 'doc', content: [{ type: 'paragraph' }] });
    for (const block of BLOCKS) {
      const node = e.schema.nodes[block.type];
      expect(node, block.type).toBeDefined();
      const made = node.create({ id: 'x' }).attrs;
      expect(made).toEqual({ id: 'x', ...block.defaults });
    }
  });

  test('blocks without ids get fresh ones; HTML round-trips attributes through data attributes', async () => {
    const e = await created(open('<p>one</p><div data-block="colorPalette" data-color-ids=\'["c-kiln-ember"]\' data-show-print="false"></div><p>two</p>'));
    const out = e.getJSON();
    expect(validateGuideline(out).ok).toBe(true);
    expect(new Set(ids(e)).size).toBe(3);
    expect(out.content![1].attrs).toMatchObject({ colorIds: ['c-kiln-ember'], showPrint: false });
    const html = e.getHTML();
    expect(html).toContain('data-block="colorPalette"');
    const again = await created(open(html));
    expect(again.getJSON().content![1].attrs).toEqual(out.content![1].attrs);
  });

  test('pasted javascript: links are not kept as links', async () => {
    const e = await created(open('<p><a href="javascript:alert(1)">bad</a> and <a href="https://example.org">good</a></p>'));
    const json = JSON.stringify(e.getJSON());
    expect(json).not.toContain('javascript:');
    expect(json).toContain('https://example.org');
    expect(validateGuideline(e.getJSON()).ok).toBe(true);
  });

  test('an identity block cannot be placed inside a list: the editor lifts it to the top level', async () => {
    const e = await created(open('<ul><li><div data-block="callout"></div></li></ul>'));
    const out = e.getJSON();
    expect(validateGuideline(out).ok).toBe(true);
    expect(out.content!.map((n) => n.type)).toContain('callout');
  });
});

describe('block commands', () => {
  const start = () =>
    open({
      type: 'doc',
      content: [
        { type: 'sectionHeading', attrs: { id: 's1', title: 'Colour' } },
        { type: 'paragraph', attrs: { id: 'p1' }, content: [{ type: 'text', text: 'Intro' }] },
        { type: 'colorPalette', attrs: { id: 'c1', colorIds: ['c-roast-umber'] } },
      ],
    });

  test('move up and down, and not past either end', () => {
    const e = start();
    expect(moveBlock(e, 2, -1)).toBe(true);
    expect(ids(e).slice(0, 3)).toEqual(['s1', 'c1', 'p1']);
    expect(moveBlock(e, 0, -1)).toBe(false);
    expect(moveBlock(e, 0, 1)).toBe(true);
    expect(ids(e).slice(0, 3)).toEqual(['c1', 's1', 'p1']);
  });

  test('duplicate gives the copy a fresh id; delete removes; undo brings it back', () => {
    const e = start();
    duplicateBlock(e, 2);
    expect(types(e).slice(0, 4)).toEqual(['sectionHeading', 'paragraph', 'colorPalette', 'colorPalette']);
    expect(new Set(ids(e)).size).toBe(ids(e).length);
    deleteBlock(e, 0);
    expect(types(e)[0]).toBe('paragraph');
    e.commands.undo();
    expect(ids(e)[0]).toBe('s1');
    expect(validateGuideline(e.getJSON()).ok).toBe(true);
  });

  test('Alt-ArrowDown moves the block holding the cursor', () => {
    const e = start();
    e.commands.setTextSelection(3);
    expect(e.state.selection.$from.parent.type.name).toBe('paragraph');
    const handled = e.view.someProp('handleKeyDown', (f) => f(e.view, new KeyboardEvent('keydown', { key: 'ArrowDown', altKey: true })));
    expect(handled).toBe(true);
    expect(ids(e).slice(0, 3)).toEqual(['s1', 'c1', 'p1']);
  });

  test('"/" in an empty paragraph opens the insert menu; elsewhere it types a slash', () => {
    let opened = 0;
    const e = open({ type: 'doc', content: [{ type: 'paragraph', attrs: { id: 'a' } }, { type: 'paragraph', attrs: { id: 'b' }, content: [{ type: 'text', text: 'x' }] }] }, { openInsertMenu: () => opened++ });
    const press = () => e.view.someProp('handleKeyDown', (f) => f(e.view, new KeyboardEvent('keydown', { key: '/' })));
    e.commands.setTextSelection(1);
    expect(press()).toBe(true);
    expect(opened).toBe(1);
    e.commands.setTextSelection(4);
    expect(press()).toBeFalsy();
    expect(opened).toBe(1);
  });

  test('every insert-menu item inserts a node the validator accepts, filled from the identity', () => {
    const items = insertItems();
    expect(items.map((i) => i.key)).toEqual(expect.arrayContaining([...BLOCKS.map((b) => b.type), 'paragraph', 'bulletList', 'blockquote']));
    const e = open({ type: 'doc', content: [{ type: 'paragraph' }] });
    for (const item of items) insertTopLevel(e, item.content(identity));
    const result = validateGuideline(e.getJSON());
    expect(result.ok ? 'valid' : result.error).toBe('valid');
    const palette = e.getJSON().content!.find((n) => n.type === 'colorPalette');
    expect(palette!.attrs!.colorIds).toEqual(identity.colors.map((c) => c.id));
    expect(filterItems(items, 'colour').map((i) => i.key)).toContain('colorPalette');
  });
});
