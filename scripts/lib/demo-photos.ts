// The demo brand's photographs, drawn by us in code: each scene is an SVG (gradients, shapes, blur, grain) rendered by
// sharp to a camera-sized JPEG. Nothing is taken from anywhere; Larchmere and its roastery are our invented scenario.
import sharp from 'sharp';

export interface DemoPhoto {
  filename: string;
  altText: string;
  caption: string;
  /** Where the subject sits, as fractions of width and height. */
  focus: { x: number; y: number };
  verdict: 'do' | 'dont';
  svg: () => string;
  /** A colour treatment applied after drawing (the "don't" example's heavy filter). */
  treatment?: 'cold-filter';
}

/** Camera size (3:2), so every crop the imagery block offers has renditions up to 2400 px wide. */
export const PHOTO_WIDTH = 3000;
export const PHOTO_HEIGHT = 2000;

/** A small seeded generator (a linear congruential one, constants from Numerical Recipes), so every start draws the same scene. */
function seeded(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

/** Scenes are drawn at half size (1500 × 1000) and scaled up: soft light hides it, and librsvg's blurs cost a quarter. */
const DRAWN_WIDTH = 1500;
const DRAWN_HEIGHT = 1000;

const frame = (body: string, defs = '') => `<svg xmlns="http://www.w3.org/2000/svg" width="${DRAWN_WIDTH}" height="${DRAWN_HEIGHT}" viewBox="0 0 1500 1000">
<defs>
  <filter id="soft" x="-20%" y="-20%" width="140%" height="140%"><feGaussianBlur stdDeviation="10"/></filter>
  <filter id="softer" x="-50%" y="-50%" width="200%" height="200%"><feGaussianBlur stdDeviation="28"/></filter>
  <filter id="haze" x="-10%" y="-10%" width="120%" height="120%"><feGaussianBlur stdDeviation="3"/></filter>
  <radialGradient id="vignette" cx="50%" cy="50%" r="75%"><stop offset="55%" stop-color="#000" stop-opacity="0"/><stop offset="100%" stop-color="#000" stop-opacity="0.45"/></radialGradient>
  ${defs}
</defs>
${body}
<rect width="1500" height="1000" fill="url(#vignette)"/>
</svg>`;

/** A cup of coffee on its saucer at (cx, cy), `s` times its drawn size, with steam. */
function cup(cx: number, cy: number, s: number, steam = true): string {
  const t = (x: number, y: number) => `${cx + x * s},${cy + y * s}`;
  return `
  <ellipse cx="${cx + 40 * s}" cy="${cy + 118 * s}" rx="${230 * s}" ry="${34 * s}" fill="#1b100a" opacity="0.45" filter="url(#soft)"/>
  <ellipse cx="${cx}" cy="${cy + 100 * s}" rx="${210 * s}" ry="${44 * s}" fill="url(#porcelain)"/>
  <ellipse cx="${cx}" cy="${cy + 94 * s}" rx="${150 * s}" ry="${26 * s}" fill="#d9d1c4"/>
  <path d="M${t(-130, -70)} C${t(-128, 40)} ${t(-90, 100)} ${t(0, 102)} C${t(90, 100)} ${t(128, 40)} ${t(130, -70)} Z" fill="url(#porcelain)"/>
  <path d="M${t(126, -30)} c${40 * s},${-8 * s} ${70 * s},${20 * s} ${52 * s},${52 * s} c${-12 * s},${22 * s} ${-40 * s},${30 * s} ${-70 * s},${26 * s}" fill="none" stroke="#ece6dc" stroke-width="${16 * s}" stroke-linecap="round"/>
  <ellipse cx="${cx}" cy="${cy - 70 * s}" rx="${130 * s}" ry="${30 * s}" fill="#f6f1ea"/>
  <ellipse cx="${cx}" cy="${cy - 66 * s}" rx="${118 * s}" ry="${24 * s}" fill="url(#crema)"/>
  <ellipse cx="${cx - 20 * s}" cy="${cy - 70 * s}" rx="${40 * s}" ry="${8 * s}" fill="#e8c9a0" opacity="0.55" filter="url(#haze)"/>
  ${
    steam
      ? [-40, 10, 55]
          .map(
            (dx, i) =>
              `<path d="M${t(dx, -100)} c${-30 * s},${-60 * s} ${40 * s},${-110 * s} ${5 * s},${-180 * s} s${-30 * s},${-120 * s} ${10 * s},${-190 * s}" fill="none" stroke="#ffffff" stroke-width="${(18 - i * 3) * s}" stroke-linecap="round" opacity="${0.35 - i * 0.06}" filter="url(#soft)"/>`,
          )
          .join('')
      : ''
  }`;
}

const CUP_DEFS = `
  <linearGradient id="porcelain" x1="0" x2="1"><stop offset="0" stop-color="#fbf8f3"/><stop offset="0.55" stop-color="#eee7dc"/><stop offset="1" stop-color="#b9ad9c"/></linearGradient>
  <radialGradient id="crema" cx="45%" cy="40%" r="60%"><stop offset="0" stop-color="#b07a48"/><stop offset="0.6" stop-color="#7a4a27"/><stop offset="1" stop-color="#3b2212"/></radialGradient>
  <linearGradient id="wood" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#9a6a45"/><stop offset="1" stop-color="#4e3020"/></linearGradient>`;

/** Grain lines of a wooden counter from y0 down. */
function woodGrain(y0: number, random: () => number): string {
  let lines = '';
  for (let i = 0; i < 26; i++) {
    const y = y0 + 12 + i * ((1000 - y0) / 26) + random() * 8;
    lines += `<path d="M0 ${y} C 400 ${y - 6 + random() * 12}, 900 ${y + 10 - random() * 20}, 1500 ${y + random() * 6}" stroke="#3a2316" stroke-width="${1 + random() * 2.5}" fill="none" opacity="${0.15 + random() * 0.2}"/>`;
  }
  return lines;
}

function morningPour(): string {
  const random = seeded(11);
  return frame(
    `<rect width="1500" height="1000" fill="url(#wall)"/>
  <polygon points="120,0 620,0 900,640 300,640" fill="#fff6e0" opacity="0.42" filter="url(#softer)"/>
  <rect y="600" width="1500" height="400" fill="url(#wood)"/>
  ${woodGrain(600, random)}
  <rect y="596" width="1500" height="10" fill="#b98a60" opacity="0.7"/>
  <ellipse cx="760" cy="720" rx="520" ry="90" fill="#ffe9c2" opacity="0.18" filter="url(#softer)"/>
  ${cup(820, 640, 1.05)}`,
    `${CUP_DEFS}<linearGradient id="wall" x1="0" x2="1"><stop offset="0" stop-color="#efe2cc"/><stop offset="0.6" stop-color="#c9ad8a"/><stop offset="1" stop-color="#6f5440"/></linearGradient>`,
  );
}

function roastedBeans(): string {
  const random = seeded(23);
  // A heap where the light falls (lower right), thinning out towards the edges: the sum of three draws is bell-shaped.
  const spread = () => (random() + random() + random()) / 3 - 0.5;
  let beans = '';
  for (let i = 0; i < 420; i++) {
    const x = 1080 + spread() * 1500;
    const y = 620 + spread() * 1000;
    const r = 24 + random() * 9;
    const angle = random() * 180;
    const tone = ['#4a2a17', '#5a331c', '#3d2213', '#6a3d21'][Math.floor(random() * 4)];
    beans += `<g transform="translate(${x.toFixed(1)} ${y.toFixed(1)}) rotate(${angle.toFixed(1)})">
      <ellipse rx="${r}" ry="${(r * 0.68).toFixed(1)}" fill="${tone}"/>
      <ellipse rx="${(r * 0.8).toFixed(1)}" ry="${(r * 0.45).toFixed(1)}" cx="${(-r * 0.15).toFixed(1)}" cy="${(-r * 0.18).toFixed(1)}" fill="url(#sheen)"/>
      <path d="M${-r * 0.85} 0 C ${-r * 0.3} ${-r * 0.22}, ${r * 0.3} ${r * 0.22}, ${r * 0.85} 0" stroke="#1e0f07" stroke-width="${(r * 0.12).toFixed(1)}" fill="none" stroke-linecap="round"/>
    </g>`;
  }
  return frame(
    `<rect width="1500" height="1000" fill="url(#surface)"/>
  ${beans}
  <rect width="1500" height="1000" fill="url(#light)"/>`,
    `<radialGradient id="sheen"><stop offset="0" stop-color="#c48a57" stop-opacity="0.35"/><stop offset="1" stop-color="#c48a57" stop-opacity="0"/></radialGradient>
  <radialGradient id="surface" cx="70%" cy="65%" r="80%"><stop offset="0" stop-color="#5a4030"/><stop offset="1" stop-color="#1d140e"/></radialGradient>
  <radialGradient id="light" cx="72%" cy="62%" r="55%"><stop offset="0" stop-color="#ffdcae" stop-opacity="0.28"/><stop offset="1" stop-color="#ffdcae" stop-opacity="0"/></radialGradient>`,
  );
}

function lakeWindow(): string {
  const random = seeded(37);
  let ripples = '';
  for (let i = 0; i < 40; i++) {
    const y = 610 + random() * 300;
    const x = 300 + random() * 900;
    ripples += `<rect x="${x.toFixed(0)}" y="${y.toFixed(0)}" width="${(40 + random() * 140).toFixed(0)}" height="2" fill="#fff4dc" opacity="${(0.15 + random() * 0.3).toFixed(2)}"/>`;
  }
  return frame(
    `<rect width="1500" height="1000" fill="#3b2f27"/>
  <g>
    <rect x="190" y="90" width="1120" height="820" fill="url(#sky)"/>
    <path d="M190 560 C 420 470, 600 520, 780 480 S 1120 450, 1310 520 L1310 600 L190 600 Z" fill="#7d8a8c" filter="url(#haze)"/>
    <path d="M190 590 C 480 540, 760 575, 1000 545 S 1230 560, 1310 575 L1310 610 L190 610 Z" fill="#55625f"/>
    <rect x="190" y="600" width="1120" height="310" fill="url(#lake)"/>
    <ellipse cx="930" cy="300" rx="120" ry="120" fill="#fff3d6" opacity="0.85" filter="url(#softer)"/>
    <rect x="860" y="600" width="140" height="310" fill="#fff0cc" opacity="0.25" filter="url(#soft)"/>
    ${ripples}
  </g>
  <rect x="172" y="72" width="1156" height="36" fill="#2a201a"/>
  <rect x="172" y="892" width="1156" height="40" fill="#2a201a"/>
  <rect x="172" y="72" width="36" height="860" fill="#2a201a"/>
  <rect x="1292" y="72" width="36" height="860" fill="#2a201a"/>
  <rect x="732" y="72" width="28" height="860" fill="#2a201a"/>
  <rect y="920" width="1500" height="80" fill="#6b4a33"/>
  ${cup(460, 860, 0.55, true)}`,
    `${CUP_DEFS}<linearGradient id="sky" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#c9d3d6"/><stop offset="0.55" stop-color="#f3e3c4"/><stop offset="1" stop-color="#f7d9a8"/></linearGradient>
  <linearGradient id="lake" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#8c9a98"/><stop offset="1" stop-color="#3f4d4f"/></linearGradient>`,
  );
}

function theCounter(): string {
  const random = seeded(53);
  const jar = (x: number, fill: number) => {
    let dots = '';
    for (let i = 0; i < 60; i++) dots += `<ellipse cx="${(x + 14 + random() * 92).toFixed(0)}" cy="${(470 - random() * fill).toFixed(0)}" rx="9" ry="6" fill="${random() > 0.5 ? '#4a2a17' : '#6a3d21'}"/>`;
    return `<rect x="${x}" y="250" width="120" height="230" rx="18" fill="#d8e0dc" opacity="0.35"/>${dots}<rect x="${x + 8}" y="262" width="16" height="200" rx="8" fill="#ffffff" opacity="0.35"/><rect x="${x - 6}" y="236" width="132" height="24" rx="6" fill="#8a6a4f"/>`;
  };
  return frame(
    `<rect width="1500" height="1000" fill="url(#back)"/>
  <rect x="0" y="200" width="1500" height="12" fill="#2c3a35" opacity="0.6"/>
  <circle cx="1120" cy="120" r="150" fill="#ffd79a" opacity="0.55" filter="url(#softer)"/>
  <path d="M1085 0 L1085 70 L1155 70 L1155 0 Z" fill="#1f2623"/>
  <path d="M1060 70 L1180 70 L1210 140 L1030 140 Z" fill="#2a3430"/>
  <ellipse cx="1120" cy="140" rx="90" ry="14" fill="#fff1cf"/>
  ${jar(180, 150)}${jar(340, 110)}${jar(500, 180)}
  <rect x="0" y="480" width="1500" height="520" fill="url(#wood)"/>
  ${woodGrain(480, random)}
  <rect x="0" y="476" width="1500" height="12" fill="#c29466" opacity="0.7"/>
  <g>
    <rect x="900" y="300" width="170" height="180" rx="14" fill="#26302c"/>
    <path d="M920 300 L1050 300 L1020 200 L950 200 Z" fill="#3a4641"/>
    <rect x="955" y="170" width="60" height="34" rx="8" fill="#c8553d"/>
    <rect x="950" y="400" width="70" height="70" rx="8" fill="#11100e" opacity="0.8"/>
  </g>
  <ellipse cx="760" cy="560" rx="700" ry="80" fill="#ffe2b0" opacity="0.12" filter="url(#softer)"/>
  ${cup(1260, 560, 0.5, true)}`,
    `${CUP_DEFS}<linearGradient id="back" x1="0" y1="0" x2="1" y2="1"><stop offset="0" stop-color="#4f635b"/><stop offset="1" stop-color="#25302c"/></linearGradient>`,
  );
}

/** The demo's photographs: four in the brand's manner, and one over-filtered shot kept as the "don't". */
export const DEMO_PHOTOS: DemoPhoto[] = [
  {
    filename: 'larchmere-morning-pour.jpg',
    altText: 'A white cup of coffee with a golden crema on a wooden counter, steam rising into soft morning light from a window on the left.',
    caption: 'Morning light, one cup, room to breathe around it.',
    focus: { x: 0.55, y: 0.5 },
    verdict: 'do',
    svg: morningPour,
  },
  {
    filename: 'larchmere-roasted-beans.jpg',
    altText: 'Freshly roasted coffee beans scattered across a dark surface, warm light catching a cluster on the right.',
    caption: 'Close details that show how the coffee is made.',
    focus: { x: 0.72, y: 0.62 },
    verdict: 'do',
    svg: roastedBeans,
  },
  {
    filename: 'larchmere-lake-window.jpg',
    altText: 'A cup on the sill of a tall window looking out over a calm lake and low hills at sunrise.',
    caption: 'The lake beyond the window: the place in every picture.',
    focus: { x: 0.62, y: 0.42 },
    verdict: 'do',
    svg: lakeWindow,
  },
  {
    filename: 'larchmere-counter.jpg',
    altText: 'The roastery counter under a pendant lamp, with glass jars of beans on the left, a grinder and a cup on the right.',
    caption: 'The counter as it is: working tools, no props.',
    focus: { x: 0.66, y: 0.45 },
    verdict: 'do',
    svg: theCounter,
  },
  {
    filename: 'larchmere-cold-filter.jpg',
    altText: 'The same cup on the counter under a harsh blue-green filter with crushed shadows.',
    caption: 'Heavy filters and cold casts hide the coffee’s own colour.',
    focus: { x: 0.55, y: 0.5 },
    verdict: 'dont',
    svg: morningPour,
    treatment: 'cold-filter',
  },
];

/** Film-like grain: mid-grey noise from the seeded generator, laid over the picture with soft light. */
function grain(seed: number): Buffer {
  const random = seeded(seed);
  const noise = Buffer.alloc(PHOTO_WIDTH * PHOTO_HEIGHT * 3);
  for (let i = 0; i < noise.length; i += 3) noise[i] = noise[i + 1] = noise[i + 2] = 128 + Math.round((random() - 0.5) * 56);
  return noise;
}

/** One demo photograph as JPEG bytes: the scene drawn, scaled to camera size, grained, and treated if it says so. */
export async function drawDemoPhoto(photo: DemoPhoto, seed = 7): Promise<Buffer> {
  let img = sharp(Buffer.from(photo.svg())).resize(PHOTO_WIDTH, PHOTO_HEIGHT);
  if (photo.treatment === 'cold-filter') img = img.modulate({ saturation: 1.6, hue: 170 }).linear(1.3, -35);
  return img
    .composite([{ input: grain(seed), raw: { width: PHOTO_WIDTH, height: PHOTO_HEIGHT, channels: 3 }, blend: 'soft-light' }])
    .removeAlpha()
    .jpeg({ quality: 84 })
    .toBuffer();
}
