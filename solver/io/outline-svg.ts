/**
 * The mask outline as SVG: width and height in millimetres with a viewBox in micrometres (1 user unit =
 * 1 µm, y flipped so the drawing reads as on screen), the fluid as one even–odd path per connected piece with
 * arcs as A commands, and the ports and wall zones in their own groups carrying their values in data-*
 * attributes, so that our own import reads them back.
 */
import type { DesignDocument } from '../../shared/design';
import { maskOutline, regionLoop } from './mask-outline';
import type { Loop, Segment } from './outline';

const UM = 1e6;

/** A coordinate in µm, rounded to a picometre, as short as it goes. */
export function um(v: number): string {
  const x = Math.round(v * UM * 1e6) / 1e6;
  return Object.is(x, -0) ? '0' : String(x);
}

function escapeXml(text: string): string {
  return text.replace(/[<>&"']/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;', "'": '&apos;' })[c]!);
}

/** Path data of one loop: x in µm, y in µm flipped. Whole circles as two half arcs. */
export function loopPathData(loop: Loop): string {
  const P = (p: [number, number]) => `${um(p[0])} ${um(-p[1])}`;
  const segs = loop.segments;
  let d = `M${P(segs[0].a)}`;
  const arcTo = (s: Extract<Segment, { kind: 'arc' }>, sweep: number, to: [number, number]) => {
    // The y flip turns counter-clockwise into SVG's negative-angle direction: sweep-flag 0.
    d += `A${um(s.radius)} ${um(s.radius)} 0 ${Math.abs(sweep) > Math.PI ? 1 : 0} ${sweep > 0 ? 0 : 1} ${P(to)}`;
  };
  for (const s of segs) {
    if (s.kind === 'line') {
      d += `L${P(s.b)}`;
    } else if (Math.abs(s.sweep) >= 2 * Math.PI - 1e-9) {
      const mid: [number, number] = [2 * s.center[0] - s.a[0], 2 * s.center[1] - s.a[1]];
      arcTo(s, s.sweep / 2, mid);
      arcTo(s, s.sweep / 2, s.a);
    } else {
      arcTo(s, s.sweep, s.b);
    }
  }
  return `${d}Z`;
}

export function designToSvg(design: DesignDocument): string {
  const mask = maskOutline(design);
  let [x0, y0, x1, y1] = mask.bounds;
  for (const p of design.ports) {
    for (const [x, y] of [p.from, p.to]) {
      x0 = Math.min(x0, x); x1 = Math.max(x1, x); y0 = Math.min(y0, y); y1 = Math.max(y1, y);
    }
  }
  if (!(x1 > x0)) [x0, y0, x1, y1] = [0, 0, 1e-3, 1e-3];
  const margin = 0.02 * Math.max(x1 - x0, y1 - y0);
  x0 -= margin; y0 -= margin; x1 += margin; y1 += margin;
  const w = x1 - x0, h = y1 - y0;
  const stroke = um(Math.max(w, h) / 400);
  const lines: string[] = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<svg xmlns="http://www.w3.org/2000/svg" width="${Math.round(w * 1e3 * 1e6) / 1e6}mm" height="${Math.round(h * 1e3 * 1e6) / 1e6}mm" viewBox="${um(x0)} ${um(-y1)} ${um(w)} ${um(h)}">`,
    `<title>${escapeXml(design.name)}: channel outline (Osmolane), 1 unit = 1 um, y up on the chip</title>`,
    `<g id="outline" fill="#0f5e63" fill-rule="evenodd" stroke="none">`,
  ];
  mask.polygons.forEach((poly, k) => lines.push(`<path id="piece-${k + 1}" d="${poly.loops.map(loopPathData).join('')}"/>`));
  lines.push('</g>');
  lines.push(`<g id="ports" stroke="#c77700" stroke-width="${stroke}" stroke-linecap="round">`);
  for (const p of design.ports) {
    const attrs = [
      `id="port-${escapeXml(p.id)}"`,
      `data-port="${escapeXml(p.id)}"`,
      p.name ? `data-name="${escapeXml(p.name)}"` : '',
      `data-potential="${p.potential === null ? 'floating' : String(p.potential)}"`,
      `data-pressure="${String(p.pressure)}"`,
      `x1="${um(p.from[0])}" y1="${um(-p.from[1])}" x2="${um(p.to[0])}" y2="${um(-p.to[1])}"`,
    ].filter(Boolean);
    lines.push(`<line ${attrs.join(' ')}/>`);
  }
  lines.push('</g>');
  lines.push(`<g id="wall-zones" fill="none" stroke="#6b4fa0" stroke-width="${stroke}" stroke-dasharray="${stroke} ${stroke}">`);
  design.wallZones.forEach((z, k) => {
    lines.push(`<path id="wall-zone-${k + 1}" data-zeta="${String(z.zeta)}" d="${loopPathData(regionLoop(z.region, `wall zone ${k + 1}`))}"/>`);
  });
  lines.push('</g>', '</svg>', '');
  return lines.join('\n');
}
