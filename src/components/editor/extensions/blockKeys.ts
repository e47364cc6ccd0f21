// Keyboard: Alt-↑/↓ move the current block, "/" in an empty paragraph or Mod-Alt-B opens the insert menu.
import { Extension } from '@tiptap/core';
import { moveBlock, topLevelIndex } from '@/components/editor/commands';

export interface BlockKeysOptions {
  openInsertMenu: () => void;
}

export const BlockKeys = Extension.create<BlockKeysOptions>({
  name: 'blockKeys',
  addOptions() {
    return { openInsertMenu: () => undefined };
  },
  addKeyboardShortcuts() {
    return {
      'Alt-ArrowUp': () => moveBlock(this.editor, topLevelIndex(this.editor), -1),
      'Alt-ArrowDown': () => moveBlock(this.editor, topLevelIndex(this.editor), 1),
      'Mod-Alt-b': () => {
        this.options.openInsertMenu();
        return true;
      },
      '/': () => {
        const { selection } = this.editor.state;
        const { $from } = selection;
        if (!selection.empty || $from.depth !== 1 || $from.parent.type.name !== 'paragraph' || $from.parent.content.size > 0) return false;
        this.options.openInsertMenu();
        return true;
      },
    };
  },
});
