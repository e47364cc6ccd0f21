// Every guideline block's Tiptap node, in registry order.
import { CalloutNode } from './callout/callout';
import { ClearSpaceNode } from './clearSpace/clearSpace';
import { ColorPaletteNode } from './colorPalette/colorPalette';
import { ContrastPairsNode } from './contrastPairs/contrastPairs';
import { DownloadsNode } from './downloads/downloads';
import { ImageryNode } from './imagery/imagery';
import { LogoShowcaseNode } from './logoShowcase/logoShowcase';
import { MinimumSizeNode } from './minimumSize/minimumSize';
import { MisuseNode } from './misuse/misuse';
import { PatternNode } from './pattern/pattern';
import { SectionHeadingNode } from './sectionHeading/sectionHeading';
import { TypographyNode } from './typography/typography';

export const BLOCK_NODES = [
  SectionHeadingNode,
  CalloutNode,
  LogoShowcaseNode,
  ClearSpaceNode,
  MinimumSizeNode,
  MisuseNode,
  ColorPaletteNode,
  ContrastPairsNode,
  TypographyNode,
  ImageryNode,
  PatternNode,
  DownloadsNode,
];
