// Types for subset-font (harfbuzz hb-subset in wasm), which ships none: the options Plumbline uses.
declare module 'subset-font' {
  interface SubsetOptions {
    targetFormat?: 'sfnt' | 'truetype' | 'woff' | 'woff2';
    /** Axis tag → a fixed value (the axis is removed) or a narrowed range. */
    variationAxes?: Record<string, number | { min: number; max: number; default?: number }>;
    preserveNameIds?: number[];
  }
  export default function subsetFont(font: Uint8Array, text: string, options?: SubsetOptions): Promise<Buffer>;
}
