/**
 * A figure layout (figure.ts) as a standalone SVG: the title, the map as an embedded PNG, a scale bar under it
 * and a vertical colour bar with ticks and the unit to its right. Pixel units (1 px = 1/96 in).
 */
import { barStops, type FigureLayout } from './figure';
import { base64, encodePng } from './png';

const FONT = "font-family=\"'IBM Plex Sans', Helvetica, Arial, sans-serif\"";

function esc(text: string): string {
  return text.replace(/[<>&"]/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;' })[c]!);
}

/** Where the pieces go, shared with the canvas drawing in the app. */
export function figureFrame(layout: FigureLayout) {
  const pad = 16, titleH = 28, barGap = 24, barW = 18, labelW = 90, scaleH = 36;
  const mapX = pad, mapY = pad + titleH;
  const barX = mapX + layout.map.width + barGap;
  const barH = Math.max(120, Math.min(layout.map.height, 320));
  return {
    width: barX + barW + labelW + pad,
    height: mapY + Math.max(layout.map.height, barH) + scaleH + pad,
    title: { x: pad, y: pad + 18 },
    map: { x: mapX, y: mapY },
    bar: { x: barX, y: mapY, width: barW, height: barH },
    scale: { x: mapX, y: mapY + layout.map.height + 16 },
  };
}

export function figureSvg(layout: FigureLayout, deflate?: (raw: Uint8Array) => Uint8Array): string {
  const fr = figureFrame(layout);
  const png = base64(encodePng(layout.map.rgba, layout.map.width, layout.map.height, deflate));
  const stops = barStops(layout)
    .map((s) => `<stop offset="${s.at}" stop-color="${s.colour}"/>`)
    .join('');
  const { bar } = fr;
  const ticks = layout.ticks
    .map((t) => {
      const y = bar.y + bar.height * (1 - t.at);
      return `<line x1="${bar.x + bar.width}" y1="${y}" x2="${bar.x + bar.width + 5}" y2="${y}" stroke="#222"/>` +
        `<text x="${bar.x + bar.width + 8}" y="${y + 4}" font-size="11">${esc(t.label)}</text>`;
    })
    .join('');
  const sb = fr.scale;
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<svg xmlns="http://www.w3.org/2000/svg" width="${fr.width}" height="${fr.height}" viewBox="0 0 ${fr.width} ${fr.height}" ${FONT} fill="#222">`,
    `<rect width="${fr.width}" height="${fr.height}" fill="#fff"/>`,
    `<text x="${fr.title.x}" y="${fr.title.y}" font-size="15" font-weight="600">${esc(layout.title)}${layout.empty ? ' (not computed)' : ''}</text>`,
    `<rect x="${fr.map.x}" y="${fr.map.y}" width="${layout.map.width}" height="${layout.map.height}" fill="#eceff1"/>`,
    `<image x="${fr.map.x}" y="${fr.map.y}" width="${layout.map.width}" height="${layout.map.height}" image-rendering="pixelated" href="data:image/png;base64,${png}"/>`,
    `<defs><linearGradient id="bar" x1="0" y1="1" x2="0" y2="0">${stops}</linearGradient></defs>`,
    `<rect x="${bar.x}" y="${bar.y}" width="${bar.width}" height="${bar.height}" fill="url(#bar)" stroke="#222" stroke-width="0.5"/>`,
    ticks,
    `<text x="${bar.x}" y="${bar.y + bar.height + 16}" font-size="11">${esc(layout.unit)}</text>`,
    `<line x1="${sb.x}" y1="${sb.y}" x2="${sb.x + layout.scaleBar.pixels}" y2="${sb.y}" stroke="#222" stroke-width="3"/>`,
    `<text x="${sb.x}" y="${sb.y + 16}" font-size="11">${esc(layout.scaleBar.label)}</text>`,
    '</svg>',
    '',
  ].join('\n');
}
