// Every block's editor node, in registry order: each folder's Settings.tsx is the view of the node its definition makes.
import type { ReactNodeViewProps } from '@tiptap/react';
import type { ComponentType } from 'react';
import { BLOCKS } from './index';
import { blockNode } from './node';

const views = import.meta.glob<ComponentType<ReactNodeViewProps>>('./*/Settings.tsx', { eager: true, import: 'Settings' });

export const BLOCK_NODES = BLOCKS.map((definition) => {
  const Settings = views[`./${definition.type}/Settings.tsx`];
  if (!Settings) throw new Error(`The block "${definition.type}" has no Settings.tsx beside its definition.`);
  return blockNode(definition, Settings);
});
