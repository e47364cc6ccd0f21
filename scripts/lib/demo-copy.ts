// The demo brand's own words in place of the starter template's instructions, so the demo publishes no template text.
// Larchmere Coffee Roasters is our invented scenario; every line here is written for it.

import { randomUUID } from 'node:crypto';

type Node = { type: string; attrs?: Record<string, unknown>; content?: Node[]; text?: string };

// Every top-level block carries an id (review comments anchor to it); nested nodes do not.
const para = (text: string, top = true): Node => ({ type: 'paragraph', ...(top ? { attrs: { id: randomUUID() } } : {}), content: [{ type: 'text', text }] });
const item = (text: string): Node => ({ type: 'listItem', content: [para(text, false)] });
const firstText = (n: Node): string => n.text ?? (n.content ?? []).map(firstText).find(Boolean) ?? '';

const STORY = [
  'Larchmere began as a roaster the size of a garden shed beside the lake road, run by two neighbours who thought the coffee in town deserved more patience than it was getting.',
  'They still roast in small batches, a few kilos at a time, and name each lot after the farm it came from. The promise is a cup that tastes of where it was grown, served by people who know why.',
];
const VALUES = [
  'Patience over speed: a roast is finished when it is ready, not when the timer says so.',
  'Named sources: every bag says which farm and which harvest, so growers get the credit.',
  'Quiet craft: we would rather explain a cup than shout about it, so no slogans on the sleeves.',
];
const MOTTO = 'Slow roasted, plainly told.';
const IMAGERY = 'Photographs show the roastery in morning light, the coffee up close and the lake beyond the window. Keep them warm, unhurried and uncropped around people’s faces; avoid staged café scenes and heavy filters.';
const SPECIMEN = 'Roasted slowly, poured with care: quiet mornings start here.';

/** A photograph on the demo shelf, as the imagery block shows it (alt text and caption come from the shelf). */
export interface DemoShelfPhoto {
  id: string;
  verdict: 'do' | 'dont';
}

/** The brand-book starter, filled with Larchmere's own copy, photographs and shelf pattern; without photographs the imagery block is left out. */
export function withDemoCopy(doc: { type: 'doc'; content: Node[] }, photos: DemoShelfPhoto[] = [], patternId: string | null = null): { type: 'doc'; content: Node[] } {
  const content: Node[] = [];
  for (const node of doc.content) {
    const text = firstText(node);
    if (node.type === 'paragraph' && text.startsWith('Write two or three short paragraphs')) content.push(...STORY.map((t) => para(t)));
    else if (node.type === 'bulletList' && text.startsWith('A value in a few words')) content.push({ ...node, content: VALUES.map(item) });
    else if (node.type === 'blockquote' && text.startsWith('A single line the brand lives by')) content.push({ ...node, content: [para(MOTTO, false)] });
    else if (node.type === 'paragraph' && text.startsWith('Replace these frames')) content.push(para(IMAGERY));
    else if (node.type === 'imagery') {
      if (photos.length === 0) continue;
      const items = photos.map((p) => ({ src: p.id, alt: '', verdict: p.verdict, caption: '' }));
      content.push({ ...node, attrs: { ...node.attrs, items, columns: 3, aspect: '4:3' } });
    }
    // The pattern block links the shelf pattern; the mock-ups carry the photographs a designer would approve.
    else if (node.type === 'pattern' && patternId) content.push({ ...node, attrs: { ...node.attrs, patternId, height: 200 } });
    else if (node.type === 'applications') {
      const chosen = photos.filter((p) => p.verdict === 'do').slice(0, 4).map((p) => p.id);
      content.push({ ...node, attrs: { ...node.attrs, photoIds: chosen } });
    }
    else if (node.type === 'typography') content.push({ ...node, attrs: { ...node.attrs, specimenText: SPECIMEN } });
    else content.push(node);
  }
  return { type: 'doc', content };
}
