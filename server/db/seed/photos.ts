// Demo photos, drawn at seed time with sharp (never downloaded): a warm gradient with a
// wheel of cheese, its rind colour and paste tone varying by style.
import sharp from 'sharp';
import { prng } from './journals';

type Look = { rind: string; paste: string; eyes: boolean };

const LOOKS: Record<string, Look> = {
  cheddar: { rind: '#b7793a', paste: '#f0b84a', eyes: false },
  'stirred-curd-cheddar': { rind: '#c08a45', paste: '#f3c560', eyes: false },
  gouda: { rind: '#c8372d', paste: '#f6dd8a', eyes: true },
  tomme: { rind: '#8c8477', paste: '#f2e3b3', eyes: true },
  caerphilly: { rind: '#e6dcc4', paste: '#fbf3dc', eyes: false },
  pecorino: { rind: '#6d5536', paste: '#f4e6c0', eyes: false },
  camembert: { rind: '#f7f4ec', paste: '#f6e7b0', eyes: false },
  feta: { rind: '#fbfaf5', paste: '#fffdf6', eyes: false },
};

/** A JPEG of a drawn wheel on a warm gradient, width × height px, varied by seed. */
export async function demoPhoto(
  styleSlug: string,
  seed: number,
  width = 1600,
  height = 1200,
): Promise<Buffer> {
  const r = prng(seed);
  const look = LOOKS[styleSlug] ?? LOOKS.cheddar;
  const cx = width * (0.45 + r() * 0.1);
  const cy = height * (0.5 + r() * 0.06);
  const radius = Math.min(width, height) * (0.3 + r() * 0.06);
  const wedge = 0.35 + r() * 0.3;
  const start = r() * Math.PI * 2;
  // A wheel seen from above at an angle: a top face (ellipse), a side band, a cut wedge.
  const ry = radius * 0.42;
  const side = radius * 0.42;
  const p = (a: number) =>
    `${(cx + radius * Math.cos(a)).toFixed(1)},${(cy + ry * Math.sin(a)).toFixed(1)}`;
  const eyes = look.eyes
    ? Array.from({ length: 9 }, () => {
        const a = start + wedge * r();
        const d = 0.2 + r() * 0.7;
        return `<ellipse cx="${(cx + radius * d * Math.cos(a)).toFixed(1)}" cy="${(cy + ry * d * Math.sin(a)).toFixed(1)}" rx="${(4 + r() * 9).toFixed(1)}" ry="${(3 + r() * 4).toFixed(1)}" fill="#e2c474" />`;
      }).join('')
    : '';
  const f = (v: number) => v.toFixed(1);
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}">
  <defs>
    <linearGradient id="bg" x1="0" y1="0" x2="1" y2="1">
      <stop offset="0" stop-color="#f6e4c3"/><stop offset="1" stop-color="#c98f5a"/>
    </linearGradient>
    <linearGradient id="band" x1="0" y1="0" x2="1" y2="0">
      <stop offset="0" stop-color="#000" stop-opacity="0.25"/><stop offset="0.5" stop-color="#000" stop-opacity="0"/><stop offset="1" stop-color="#000" stop-opacity="0.3"/>
    </linearGradient>
  </defs>
  <rect width="100%" height="100%" fill="url(#bg)"/>
  <rect x="0" y="${f(height * 0.62)}" width="100%" height="${f(height * 0.38)}" fill="#8a5a34" opacity="0.55"/>
  <ellipse cx="${f(cx)}" cy="${f(cy + side + ry * 0.6)}" rx="${f(radius * 1.08)}" ry="${f(ry * 0.55)}" fill="#3b2413" opacity="0.28"/>
  <path d="M${f(cx - radius)},${f(cy)} L${f(cx - radius)},${f(cy + side)} A${f(radius)},${f(ry)} 0 0 0 ${f(cx + radius)},${f(cy + side)} L${f(cx + radius)},${f(cy)} Z" fill="${look.rind}"/>
  <path d="M${f(cx - radius)},${f(cy)} L${f(cx - radius)},${f(cy + side)} A${f(radius)},${f(ry)} 0 0 0 ${f(cx + radius)},${f(cy + side)} L${f(cx + radius)},${f(cy)} Z" fill="url(#band)"/>
  <ellipse cx="${f(cx)}" cy="${f(cy)}" rx="${f(radius)}" ry="${f(ry)}" fill="${look.rind}"/>
  <ellipse cx="${f(cx)}" cy="${f(cy)}" rx="${f(radius * 0.94)}" ry="${f(ry * 0.92)}" fill="#ffffff" opacity="0.08"/>
  <path d="M${f(cx)},${f(cy)} L${p(start)} A${f(radius)},${f(ry)} 0 0 1 ${p(start + wedge)} Z" fill="${look.paste}"/>
  ${eyes}
</svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 82 }).toBuffer();
}
