// A shelf of approved files; the list is filled once assets exist.
import { refIdSchema } from '@/lib/guideline/ids';
import { defineBlock, distinctList, text } from '@/blocks/define';

export const downloadsBlock = defineBlock({
  type: 'downloads',
  order: 120,
  label: 'Downloads',
  description: 'A list of approved files readers may download.',
  group: 'files',
  fields: {
    title: text(200, 'Files to download'),
    assetIds: distinctList(refIdSchema('asset'), 100, 'files').default(() => []),
    note: text(500),
  },
  refs: { assetIds: 'asset' },
});
export const downloadsSchema = downloadsBlock.schema;
export type DownloadsAttrs = ReturnType<typeof downloadsSchema.parse>;

export default downloadsBlock;
