import { deflateSync } from 'node:zlib';
import PDFDocument from 'pdfkit';
import type { DesignDocument } from '../../shared/design';
import { COLOUR_MAPS } from '../../shared/colour-maps';
import { LIMITS } from '../../shared/physics';
import { fluidRegion } from '../../solver/geometry/fluid-region';
import { channelWidths } from '../../solver/geometry/channel-width';
import { ductError } from '../../solver/io/duct-error';
import { formatNumber, lengthLabel, mapFigure, type FigureLayout, type MapQuantity } from '../../solver/io/figure';
import { encodePng } from '../../solver/io/png';
import type { SolveResult } from '../../solver/solve';

/** Everything the report shows about where the run came from. */
export interface ReportInput {
  design: DesignDocument;
  designName: string;
  workspace: string;
  revision: { number: number; note: string; createdAt: string };
  run: { id: number; createdAt: string; author: string };
  review: { state: string; approvedBy: string | null; approvedAt: string | null };
  result: SolveResult;
  version: string;
}

const TEAL = '#0f5e63', AMBER = '#b36b00', INK = '#222222', GREY = '#666666';
const MAPS: MapQuantity[] = ['potential', 'fieldStrength', 'speed', 'vorticity', 'pressure'];
const HV = LIMITS.highVoltage;

/** Text for the PDF's standard fonts (WinAnsi): Greek and math signs spelled out. */
function plain(text: string): string {
  return text
    .replace(/ε/g, 'eps').replace(/ζ/g, 'zeta').replace(/λ/g, 'lambda').replace(/μ/g, 'µ').replace(/Ω/g, 'ohm')
    .replace(/≈/g, '~').replace(/≤/g, '<=').replace(/≥/g, '>=').replace(/−/g, '-').replace(/→/g, '->')
    .replace(/[^\x20-\x7e\xa0-\xff\u2013\u2014\u2018\u2019\u201c\u201d\u2022]/g, '?');
}

const num = (v: number | null | undefined, digits = 4) => (v === null || v === undefined || !Number.isFinite(v) ? '-' : String(Number(v.toPrecision(digits))));

/** Draws the report and resolves with the PDF bytes. */
export function runReportPdf(input: ReportInput): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 50, compress: true, info: { Title: plain(`Run report: ${input.designName}`), Author: 'Osmolane', Subject: `Run ${input.run.id}` } });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const { design, result } = input;
  const W = doc.page.width - 100;
  const heading = (t: string) => {
    if (doc.y > doc.page.height - 140) doc.addPage();
    doc.moveDown(0.6).font('Helvetica-Bold').fontSize(12).fillColor(TEAL).text(plain(t)).moveDown(0.2).font('Helvetica').fontSize(9.5).fillColor(INK);
  };
  const para = (t: string) => doc.font('Helvetica').fontSize(9.5).fillColor(INK).text(plain(t), { width: W });
  const table = (cols: Array<{ title: string; width: number }>, rows: string[][]) => {
    const x0 = doc.page.margins.left;
    const line = (cells: string[], bold: boolean) => {
      if (doc.y > doc.page.height - 80) doc.addPage();
      const y = doc.y;
      let x = x0;
      doc.font(bold ? 'Helvetica-Bold' : 'Helvetica').fontSize(9);
      cells.forEach((c, k) => {
        doc.text(plain(c), x, y, { width: cols[k].width - 6, lineBreak: false, ellipsis: true });
        x += cols[k].width;
      });
      doc.x = x0;
      doc.y = y + 13;
    };
    line(cols.map((c) => c.title), true);
    doc.moveTo(x0, doc.y - 2).lineTo(x0 + cols.reduce((s, c) => s + c.width, 0), doc.y - 2).lineWidth(0.5).strokeColor(GREY).stroke();
    rows.forEach((r) => line(r, false));
    doc.moveDown(0.3);
  };

  // Title block.
  doc.font('Helvetica-Bold').fontSize(18).fillColor(TEAL).text(plain(`Run report: ${input.designName}`));
  doc.font('Helvetica').fontSize(9.5).fillColor(GREY).text(plain(
    `Workspace ${input.workspace} · revision ${input.revision.number}${input.revision.note ? ` ("${input.revision.note}")` : ''} of ${input.revision.createdAt.slice(0, 10)} · ` +
    `run ${input.run.id}, stored ${input.run.createdAt.slice(0, 16).replace('T', ' ')} UTC by ${input.run.author}`,
  ));
  const approval = input.review.state === 'mask-ready'
    ? `Review state: mask-ready, approved by ${input.review.approvedBy ?? 'unknown'}${input.review.approvedAt ? ` on ${input.review.approvedAt.slice(0, 10)}` : ''}.`
    : `Review state: ${input.review.state} (not approved for the mask).`;
  doc.font('Helvetica-Bold').fillColor(input.review.state === 'mask-ready' ? TEAL : AMBER).text(plain(approval));

  // High-voltage caution, first thing, whenever a port is above 50 V.
  const hv = design.ports.filter((p) => p.potential !== null && Math.abs(p.potential) > HV);
  if (hv.length) {
    const y = doc.y + 6;
    doc.rect(50, y, W, 58).fillColor('#fff4e0').fill().rect(50, y, 4, 58).fillColor(AMBER).fill();
    doc.fillColor(INK).font('Helvetica-Bold').fontSize(10).text('High-voltage caution', 62, y + 6);
    doc.font('Helvetica').fontSize(9).text(plain(
      `Ports ${hv.map((p) => `${p.id} (${num(p.potential, 4)} V)`).join(', ')} are above ${HV} V. Supplies of this kind can kill: use current-limited supplies and ` +
      'interlocked enclosures that cut and discharge the voltage when opened; never touch reservoirs, electrodes or liquid while energised. Follow your local electrical-safety rules.',
    ), 62, y + 20, { width: W - 20 });
    doc.x = 50;
    doc.y = y + 64;
  }

  // Layout drawing.
  heading('Layout');
  drawLayout(doc, design, 50, doc.y, W, 200);

  heading('Conditions');
  const b = design.buffer;
  para(`Channel depth ${lengthLabel(design.depth)}. Buffer: relative permittivity ${num(b.relativePermittivity)}, viscosity ${num(b.viscosity)} Pa s, density ${num(b.density)} kg/m³, ` +
    `conductivity ${num(b.conductivity)} S/m, ionic strength ${num(b.ionicStrength)} mol/m³, temperature ${num(b.temperature, 5)} K. ` +
    `Zeta potential: side walls ${num(design.zeta.side * 1e3)} mV, floor ${num(design.zeta.floor * 1e3)} mV, lid ${num(design.zeta.lid * 1e3)} mV; ${design.wallZones.length} wall zone(s)` +
    `${design.wallZones.length ? `: ${design.wallZones.map((z, k) => `zone ${k + 1} ${num(z.zeta * 1e3)} mV`).join(', ')}` : ''}.`);
  doc.moveDown(0.4);
  table(
    [{ title: 'Port', width: 70 }, { title: 'Name', width: 150 }, { title: 'Potential (V)', width: 90 }, { title: 'Pressure (Pa)', width: 90 }],
    design.ports.map((p) => [p.id, p.name ?? '', p.potential === null ? 'floating' : num(p.potential), num(p.pressure)]),
  );

  heading('Port table');
  para('Current and flow rate are positive when they enter the fluid through the port; they sum to zero over the ports. ' +
    'Mean speed is that of the channel leg the port feeds: |flow rate| / (port width × depth).');
  doc.moveDown(0.3);
  table(
    [{ title: 'Port', width: 60 }, { title: 'Potential (V)', width: 90 }, { title: 'Current (µA)', width: 100 }, { title: 'Flow rate (nL/min)', width: 115 }, { title: 'Mean speed (mm/s)', width: 115 }],
    result.ports.map((p) => [p.id, p.potential === null ? '-' : num(p.potential), num(p.current * 1e6), num(p.flowRate * 6e13), p.meanSpeed === undefined ? '-' : num(p.meanSpeed * 1e3)]),
  );
  const m = result.metrics;
  para(`Joule power ${num(m.joulePower)} W · largest field ${num(m.maxField)} V/m · largest speed ${num(m.maxSpeed)} m/s · ` +
    `largest wall shear rate ${num(m.maxWallShearRate)} 1/s · Debye length ${lengthLabel(m.debyeLength)} · ` +
    `Reynolds number ${num(m.reynolds, 3)} · grid ${result.grid.nx} × ${result.grid.ny} cells of ${lengthLabel(result.grid.spacing)}.`);

  heading('Warnings');
  if (result.warnings.length === 0) para('None.');
  for (const w of result.warnings) para(`• ${w.message} (${w.code})`);

  heading('Assumptions and limits of the model');
  const region = fluidRegion(design.shapes);
  const narrowest = channelWidths(region).narrowest?.width ?? null;
  const duct = narrowest ? ductError(design.depth, narrowest) : null;
  for (const t of [
    'Thin electric double layer: the wall charge acts as a Helmholtz–Smoluchowski slip velocity; checked against the Debye length above.',
    'Creeping flow (Reynolds number well below 1), uniform buffer, steady state; Joule heating is estimated, not coupled back into the properties.',
    'Flow is depth-averaged (Stokes–Brinkman with a 12 µ/d² friction from floor and lid): the side-wall layers are resolved in the plane, the depth profile is assumed.',
    duct
      ? `For this layout's narrowest channel (${lengthLabel(narrowest!)} wide, ${lengthLabel(design.depth)} deep, depth/width ${num(duct.aspect, 3)}) the model's pressure-driven flow rate is ` +
        `${num(duct.model, 4)} of the parallel-plate value against ${num(duct.exact, 4)} for the exact rectangular duct (F. M. White; H. Bruus): an error of ${num(duct.error * 100, 2)} %. Electroosmotic plug flow is not affected.`
      : 'The model error against the exact rectangular duct could not be evaluated (no channel width found).',
  ]) para(`• ${t}`);

  // Maps, two to a page.
  for (const [k, q] of MAPS.entries()) {
    if (k % 2 === 0) doc.addPage();
    const fig = mapFigure(result.fields, q, { maxWidth: 900, maxHeight: 500 });
    drawFigure(doc, fig, 50, k % 2 === 0 ? 50 : doc.page.height / 2 + 10, W, doc.page.height / 2 - 80);
  }
  doc.font('Helvetica').fontSize(8).fillColor(GREY).text(plain(`Osmolane ${input.version}. Maps recomputed from revision ${input.revision.number} with the run's settings.`), 50, doc.page.height - 60, { width: W });
  doc.end();
  return done;
}

type Doc = InstanceType<typeof PDFDocument>;

function drawLayout(doc: Doc, design: DesignDocument, x: number, y: number, w: number, h: number): void {
  const region = fluidRegion(design.shapes);
  const [x0, y0, x1, y1] = region.bounds;
  if (!(x1 > x0)) {
    doc.text('(no fluid)', x, y);
    return;
  }
  const s = Math.min(w / (x1 - x0), h / (y1 - y0));
  const X = (v: number) => x + (v - x0) * s, Y = (v: number) => y + (y1 - v) * s;
  for (const poly of region.polygons) {
    for (const ring of poly) {
      ring.forEach((p, k) => (k === 0 ? doc.moveTo(X(p[0]), Y(p[1])) : doc.lineTo(X(p[0]), Y(p[1]))));
      doc.closePath();
    }
  }
  doc.lineWidth(0.5).fillAndStroke('#cfe5e6', TEAL, 'even-odd');
  doc.fillColor(AMBER).font('Helvetica-Bold').fontSize(8);
  for (const p of design.ports) {
    doc.moveTo(X(p.from[0]), Y(p.from[1])).lineTo(X(p.to[0]), Y(p.to[1])).lineWidth(2).strokeColor(AMBER).stroke();
    doc.text(plain(p.id), X((p.from[0] + p.to[0]) / 2) + 3, Y((p.from[1] + p.to[1]) / 2) - 4, { lineBreak: false });
  }
  doc.lineWidth(1).fillColor(INK).font('Helvetica').fontSize(8).text(`${lengthLabel(x1 - x0)} × ${lengthLabel(y1 - y0)}`, x, y + (y1 - y0) * s + 4);
  doc.x = x;
  doc.y = y + (y1 - y0) * s + 18;
}

function drawFigure(doc: Doc, fig: FigureLayout, x: number, y: number, w: number, h: number): void {
  doc.font('Helvetica-Bold').fontSize(11).fillColor(INK).text(plain(`${fig.title}${fig.empty ? ' (not computed)' : ''}`), x, y);
  const top = y + 18;
  const mapW = w - 90, mapH = h - 50;
  const s = Math.min(mapW / fig.map.width, mapH / fig.map.height);
  const dw = fig.map.width * s, dh = fig.map.height * s;
  doc.rect(x, top, dw, dh).fillColor('#eceff1').fill();
  const png = Buffer.from(encodePng(fig.map.rgba, fig.map.width, fig.map.height, (raw) => deflateSync(raw)));
  doc.image(png, x, top, { width: dw, height: dh });
  // Colour bar with ticks and unit.
  const bx = x + dw + 16, bw = 12, bh = Math.min(dh, 200);
  const grad = doc.linearGradient(bx, top + bh, bx, top);
  const stops = COLOUR_MAPS[fig.colourMap].stops;
  stops.forEach((c, k) => grad.stop(k / (stops.length - 1), `#${c.map((v) => v.toString(16).padStart(2, '0')).join('')}`));
  doc.rect(bx, top, bw, bh).fill(grad);
  doc.rect(bx, top, bw, bh).lineWidth(0.5).strokeColor(INK).stroke();
  doc.font('Helvetica').fontSize(7.5).fillColor(INK);
  for (const t of fig.ticks) {
    const ty = top + bh * (1 - t.at);
    doc.moveTo(bx + bw, ty).lineTo(bx + bw + 3, ty).stroke();
    doc.text(plain(t.label), bx + bw + 5, ty - 3, { lineBreak: false });
  }
  doc.text(plain(fig.unit), bx, top + bh + 5, { lineBreak: false });
  // Scale bar.
  const sbw = fig.scaleBar.pixels * s;
  doc.moveTo(x, top + dh + 10).lineTo(x + sbw, top + dh + 10).lineWidth(2).strokeColor(INK).stroke().lineWidth(1);
  doc.text(plain(fig.scaleBar.label), x, top + dh + 14, { lineBreak: false });
  doc.text(plain(`range ${formatNumber(fig.range[0])} to ${formatNumber(fig.range[1])} ${fig.unit}`), x + sbw + 12, top + dh + 14, { lineBreak: false });
  doc.x = x;
}
