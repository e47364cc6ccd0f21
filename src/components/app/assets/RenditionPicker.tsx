// Pick a rendition of one asset (format, width, background, variant or a ready-made preset) and get its link.
import { useState } from 'react';
import { PRINT_CAUTION, VECTOR_PRINT_NOTE } from '@/lib/cautions';
import { MAX_WIDTH, MIN_WIDTH, PRESET_INFO, RENDITION_PRESETS, type RenditionPreset } from '@/lib/assets/kinds';
import type { ShelfAsset } from './AssetShelf';

type Format = 'png' | 'jpg' | 'webp' | 'svg' | 'tiff' | 'pdf' | 'eps';
type Variant = 'original' | 'black' | 'white' | 'reversed' | 'one-colour';

export function RenditionPicker({ asset, brandColors }: { asset: ShelfAsset; brandColors: { name: string; hex: string }[] }) {
  const [preset, setPreset] = useState<RenditionPreset | ''>('');
  const [format, setFormat] = useState<Format>(asset.format === 'svg' ? 'svg' : 'png');
  const [width, setWidth] = useState('1024');
  const [background, setBackground] = useState('transparent');
  const [variant, setVariant] = useState<Variant>('original');
  const [color, setColor] = useState(brandColors[0]?.hex ?? '#000000');
  const [colorSpace, setColorSpace] = useState<'cmyk' | 'rgb'>('cmyk');

  if (!asset.renderable) {
    return (
      <div className="rounded-md bg-paper p-3 text-sm">
        <p>{asset.format.toUpperCase()} files are handed out as uploaded.</p>
        <a className="btn-primary mt-2 px-3 py-1.5" href={`${asset.files.original}?download=1`}>Download the original</a>
      </div>
    );
  }

  const n = Number(width);
  const widthOk = Number.isInteger(n) && n >= MIN_WIDTH && n <= MAX_WIDTH;
  const q = new URLSearchParams();
  if (preset) {
    q.set('preset', preset);
    if ((preset === 'social-avatar' || preset === 'print') && widthOk) q.set('width', String(n));
    if (preset !== 'print' && background !== 'transparent') q.set('background', background);
  } else if (format === 'pdf' || format === 'eps') {
    q.set('format', format);
    q.set('colorSpace', colorSpace);
  } else {
    q.set('format', format);
    if (format !== 'svg' && widthOk) q.set('width', String(n));
    if (background !== 'transparent' || format === 'jpg' || format === 'tiff') q.set('background', background === 'transparent' ? '#ffffff' : background);
  }
  const vectorPrint = !preset && (format === 'pdf' || format === 'eps');
  if (asset.kind === 'logo' && variant !== 'original' && !vectorPrint) {
    q.set('variant', variant);
    if (variant === 'one-colour' || variant === 'reversed') q.set('color', color);
  }
  q.set('download', '1');
  const href = `${asset.files.original}?${q}`;
  const print = preset === 'print' || (!preset && (format === 'tiff' || format === 'pdf' || format === 'eps'));
  const needsWidth = preset === '' ? format !== 'svg' && !vectorPrint : preset === 'social-avatar' || preset === 'print';
  const id = (s: string) => `${s}-${asset.id}`;
  // What the button gives, in words: "PNG, 1024 px wide, on a transparent ground".
  const describe = () => {
    if (preset) return `${PRESET_INFO[preset].label}${needsWidth && widthOk ? `, ${width} px wide` : ''}.`;
    const parts = [format === 'svg' ? 'SVG, scales to any size' : `${format.toUpperCase()}${widthOk ? `, ${width} px wide` : ''}`];
    parts.push(background === 'transparent' && format !== 'jpg' && format !== 'tiff' ? 'on a transparent ground' : `on ${background === 'transparent' ? 'white' : brandColors.find((c) => c.hex === background)?.name ?? background}`);
    return `${parts.join(', ')}.`;
  };

  return (
    <form className="space-y-3 rounded-md bg-paper p-3 text-sm" onSubmit={(e) => e.preventDefault()} aria-label={`Rendition of ${asset.name}`}>
      <div className="grid grid-cols-2 gap-3">
        <div className="col-span-2">
          <label className="label" htmlFor={id('preset')}>Ready-made</label>
          <select id={id('preset')} className="field py-1.5 text-sm" value={preset} onChange={(e) => setPreset(e.target.value as RenditionPreset | '')}>
            <option value="">None: choose format and width</option>
            {RENDITION_PRESETS.map((p) => <option key={p} value={p}>{PRESET_INFO[p].label}</option>)}
          </select>
          {preset && <p className="hint">{PRESET_INFO[preset].hint}</p>}
        </div>
        {!preset && (
          <div>
            <label className="label" htmlFor={id('format')}>Format</label>
            <select id={id('format')} className="field py-1.5 text-sm" value={format} onChange={(e) => setFormat(e.target.value as Format)}>
              {asset.format === 'svg' && <option value="svg">SVG (vector)</option>}
              <option value="png">PNG</option>
              <option value="jpg">JPEG</option>
              <option value="webp">WebP</option>
              <option value="tiff">TIFF, CMYK for print</option>
              {asset.format === 'svg' && <option value="pdf">PDF, vector for print</option>}
              {asset.format === 'svg' && <option value="eps">EPS, vector for print</option>}
            </select>
            {asset.kind === 'logo' && asset.format !== 'svg' && <p className="hint">No PDF or EPS: this logo is a raster image, and a print file around its pixels would not be vector. Ask the designer for the SVG.</p>}
          </div>
        )}
        {needsWidth && (
          <div>
            <label className="label" htmlFor={id('width')}>Width (px)</label>
            <input id={id('width')} className="field py-1.5 text-sm" inputMode="numeric" value={width} onChange={(e) => setWidth(e.target.value)} aria-invalid={!widthOk} aria-describedby={id('width-hint')} />
            <p id={id('width-hint')} className={widthOk ? 'hint' : 'error-text'}>{MIN_WIDTH}–{MAX_WIDTH} px</p>
          </div>
        )}
        {vectorPrint && (
          <div>
            <label className="label" htmlFor={id('space')}>Colour</label>
            <select id={id('space')} className="field py-1.5 text-sm" value={colorSpace} onChange={(e) => setColorSpace(e.target.value as 'cmyk' | 'rgb')}>
              <option value="cmyk">CMYK</option>
              <option value="rgb">RGB</option>
            </select>
            <p className="hint">The logo as drawn, page cut to its drawn bounds.</p>
          </div>
        )}
        {!vectorPrint && <div>
          <label className="label" htmlFor={id('bg')}>Background</label>
          <select id={id('bg')} className="field py-1.5 text-sm" value={background} onChange={(e) => setBackground(e.target.value)}>
            <option value="transparent">Transparent</option>
            <option value="#ffffff">White</option>
            <option value="#000000">Black</option>
            {brandColors.map((c) => <option key={c.hex + c.name} value={c.hex}>{c.name} {c.hex}</option>)}
          </select>
        </div>}
        {asset.kind === 'logo' && !vectorPrint && (
          <div>
            <label className="label" htmlFor={id('variant')}>Colour version</label>
            <select id={id('variant')} className="field py-1.5 text-sm" value={variant} onChange={(e) => setVariant(e.target.value as Variant)}>
              <option value="original">As designed</option>
              <option value="black">One colour: black</option>
              <option value="white">One colour: white, transparent ground</option>
              <option value="reversed">White on a colour field (shapes in the ground colour cut out)</option>
              <option value="one-colour">One brand colour</option>
            </select>
          </div>
        )}
        {asset.kind === 'logo' && !vectorPrint && (variant === 'one-colour' || variant === 'reversed') && (
          <div>
            <label className="label" htmlFor={id('ink')}>{variant === 'reversed' ? 'Field colour' : 'Ink'}</label>
            <select id={id('ink')} className="field py-1.5 text-sm" value={color} onChange={(e) => setColor(e.target.value)}>
              {[...brandColors, { name: 'Black', hex: '#000000' }].map((c) => <option key={c.hex + c.name} value={c.hex}>{c.name} {c.hex}</option>)}
            </select>
          </div>
        )}
      </div>
      {print && <p className="rounded bg-warn-wash p-2 text-warn">{PRINT_CAUTION}{vectorPrint ? ` ${VECTOR_PRINT_NOTE}` : ''}</p>}
      <a className={`btn-primary px-3 py-1.5 ${needsWidth && !widthOk ? 'pointer-events-none opacity-60' : ''}`} href={href} aria-disabled={needsWidth && !widthOk}>Download</a>
      <p className="text-xs text-ink-soft">{describe()}</p>
    </form>
  );
}
