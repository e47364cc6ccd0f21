// The editor's whole schema: our document node, the starter kit's rich text (trimmed), every block, ids and keys.
import { Node, type AnyExtension } from '@tiptap/core';
import StarterKit from '@tiptap/starter-kit';
import { isSafeHref } from '@/lib/guideline/links';
import { BLOCK_NODES } from '@/blocks/editor';
import { BlockIds } from './blockIds';
import { BlockKeys } from './blockKeys';

/** Guideline blocks live only at the top level; rich text may nest in lists and quotes. */
const GuidelineDocNode = Node.create({ name: 'doc', topNode: true, content: '(block | guidelineBlock)+' });

export function guidelineExtensions(options: { openInsertMenu?: () => void } = {}): AnyExtension[] {
  return [
    GuidelineDocNode,
    StarterKit.configure({
      document: false,
      // Rich text wears the published page's flow-* classes (global.css), so it reads in the editor as it will publish.
      paragraph: { HTMLAttributes: { class: 'flow-p' } },
      heading: { levels: [2, 3, 4], HTMLAttributes: { class: 'flow-heading' } },
      bulletList: { HTMLAttributes: { class: 'flow-ul' } },
      orderedList: { HTMLAttributes: { class: 'flow-ol' } },
      listItem: { HTMLAttributes: { class: 'flow-li' } },
      blockquote: { HTMLAttributes: { class: 'flow-quote' } },
      code: false,
      codeBlock: false,
      strike: false,
      underline: false,
      horizontalRule: false,
      link: {
        openOnClick: false,
        autolink: true,
        defaultProtocol: 'https',
        protocols: [],
        isAllowedUri: (url) => isSafeHref(url),
        shouldAutoLink: (url) => isSafeHref(url) || isSafeHref(`https://${url}`),
      },
    }),
    ...BLOCK_NODES,
    BlockIds,
    BlockKeys.configure({ openInsertMenu: options.openInsertMenu ?? (() => undefined) }),
  ];
}
