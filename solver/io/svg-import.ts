/**
 * SVG outlines to a drawing (drawing.ts). SVG is untrusted: the file is refused whole when it declares
 * entities, holds a script, an event handler, a foreign object or any reference outside the file; it is parsed
 * by a real XML parser (@xmldom/xmldom, which resolves no external entity) within IMPORT_LIMITS.
 *
 * Drawn: path (lines, Béziers flattened, circular arcs kept as arcs), rect (rounded corners as arcs), circle,
 * ellipse, polygon, polyline, line, inside g/svg/a/switch with their transforms. Groups named "ports" and
 * "wall-zones" (id, inkscape:label or data-layer) carry port segments and wall-zone outlines, with their
 * values in data-* attributes (as our own export writes them). Everything else that draws is reported.
 */
import { DOMParser, type Element } from '@xmldom/xmldom';
import type { Vec2 } from '../geometry/ring';
import { apply, compose, parseTransform, TransformSyntaxError, type Affine } from './affine';
import type { DrawingPort, ImportedDrawing } from './drawing';
import { isClosed, joinChains, type Chain } from './join';
import { checkRaw, IMPORT_LIMITS, ImportError } from './limits';
import { gap, type Loop, type Segment, type Skipped } from './outline';
import { mappedCircleArc, mappedEllipse, mapSegment } from './svg-segments';
import { parsePathData, PathSyntaxError, type Subpath } from './svg-path';
import { svgUnits, userLength } from './svg-units';

const HOSTILE_ELEMENTS = new Set(['script', 'foreignobject', 'iframe', 'embed', 'object', 'handler', 'listener', 'audio', 'video', 'animate', 'set', 'animatetransform', 'animatemotion']);
const CONTAINERS = new Set(['g', 'svg', 'a', 'switch']);
const NOT_DRAWN = new Set(['defs', 'symbol', 'clippath', 'mask', 'pattern', 'marker', 'lineargradient', 'radialgradient', 'filter']);
const SILENT = new Set(['title', 'desc', 'metadata', 'style']);
const SVG_NS = 'http://www.w3.org/2000/svg';

export interface SvgImportOptions {
  /** Metres per user unit, overriding the document's own size. */
  scale?: number;
}

/** Refusals that need no parsing: size, entity declarations and internal DTD subsets. */
function preScan(text: string): void {
  if (text.length > IMPORT_LIMITS.maxBytes) throw new ImportError('too-large', `the SVG is larger than ${IMPORT_LIMITS.maxBytes} bytes`);
  if (/<!ENTITY/i.test(text)) throw new ImportError('hostile', 'the SVG declares XML entities, which are not accepted (they can expand without bound or reach outside the file)');
  if (/<!DOCTYPE[^>[]*\[/i.test(text)) throw new ImportError('hostile', 'the SVG has an internal DTD subset, which is not accepted');
  if (!/<svg[\s>]/i.test(text.slice(0, 64 * 1024)) && !/<[a-z]+:svg[\s>]/i.test(text.slice(0, 64 * 1024))) {
    throw new ImportError('malformed', 'the file is not an SVG drawing (no <svg> element near its start)');
  }
}

function describe(el: Element): string {
  const id = el.getAttribute('id');
  return `<${el.localName}${id ? ` id="${id.slice(0, 40)}"` : ''}>`;
}

/** Refuses scripts, handlers and references that leave the file, anywhere in the document. */
function checkHostile(all: Element[]): void {
  for (const el of all) {
    const name = (el.localName ?? '').toLowerCase();
    if (HOSTILE_ELEMENTS.has(name)) throw new ImportError('hostile', `the SVG contains ${describe(el)}; scripts, animations and embedded documents are not accepted`);
    for (let k = 0; k < el.attributes.length; k++) {
      const a = el.attributes.item(k)!;
      const an = (a.localName ?? a.name).toLowerCase();
      const value = a.value ?? '';
      if (an.startsWith('on')) throw new ImportError('hostile', `the SVG has an event handler (${a.name}) on ${describe(el)}; scripts are not accepted`);
      if (an === 'href' && !value.trim().startsWith('#')) throw new ImportError('hostile', `${describe(el)} refers outside the file (${a.name}="${value.slice(0, 60)}"); external references are not accepted`);
      if (/javascript:|vbscript:|data:text\/html/i.test(value)) throw new ImportError('hostile', `${describe(el)} has a script URL in ${a.name}`);
      if (/url\(\s*['"]?\s*(?!#)|@import|expression\(/i.test(value)) throw new ImportError('hostile', `${describe(el)} has a style that loads from outside the file (${a.name})`);
    }
    if (name === 'style' && /url\(\s*['"]?\s*(?!#)|@import|expression\(/i.test(el.textContent ?? '')) {
      throw new ImportError('hostile', 'a <style> element loads from outside the file');
    }
  }
}

function parseXml(text: string): Element {
  let root: Element | null = null;
  try {
    const doc = new DOMParser({
      onError: (level, message) => {
        if (level !== 'warning') throw new Error(message);
      },
    }).parseFromString(text, 'image/svg+xml');
    root = doc.documentElement;
  } catch (error) {
    const why = String((error as Error).message ?? error).replace(/^.*caused Error: /, '').split('\n')[0].slice(0, 160);
    throw new ImportError('malformed', `the SVG is not well-formed XML: ${why}`);
  }
  if (!root || root.localName !== 'svg') throw new ImportError('malformed', 'the document element is not <svg>');
  return root;
}

function layerOf(el: Element): 'ports' | 'wall-zones' | null {
  const label = [el.getAttribute('id'), el.getAttribute('data-layer'), el.getAttributeNS('http://www.inkscape.org/namespaces/inkscape', 'label')]
    .filter((v): v is string => !!v)
    .map((v) => v.trim().toLowerCase());
  if (label.some((v) => /^ports?$/.test(v))) return 'ports';
  if (label.some((v) => /^wall[-_ ]?zones?$/.test(v))) return 'wall-zones';
  return null;
}

function hidden(el: Element): boolean {
  return el.getAttribute('display') === 'none' || /display\s*:\s*none/i.test(el.getAttribute('style') ?? '');
}

function numbers(text: string, what: string): number[] {
  if (text.length > IMPORT_LIMITS.maxPathChars) throw new ImportError('too-large', `${what} has more than ${IMPORT_LIMITS.maxPathChars} characters`);
  const parts = text.trim() === '' ? [] : text.trim().split(/[\s,]+/);
  const v = parts.map(Number);
  if (v.some((x) => !Number.isFinite(x))) throw new ImportError('malformed', `${what} has something that is not a number`);
  v.forEach((x) => checkRaw(x, what));
  return v;
}

class Walker {
  readonly chains: Chain[] = [];
  readonly portChains: Array<{ el: Element; chain: Chain }> = [];
  readonly zoneChains: Array<{ el: Element; chain: Chain }> = [];
  readonly skipped: Skipped[] = [];
  private segments = 0;

  private at(m: Affine, p: Vec2): Vec2 {
    return apply(m, p);
  }

  private count(n: number): void {
    this.segments += n;
    if (this.segments > IMPORT_LIMITS.maxSegments) throw new ImportError('too-large', `the drawing has more than ${IMPORT_LIMITS.maxSegments} segments`);
  }

  walk(el: Element, m: Affine, layer: 'ports' | 'wall-zones' | null, depth: number): void {
    if (depth > 64) throw new ImportError('too-large', 'the SVG nests groups more than 64 deep');
    const name = (el.localName ?? '').toLowerCase();
    if (el.namespaceURI && el.namespaceURI !== SVG_NS) return; // another program's metadata (e.g. sodipodi:namedview)
    if (SILENT.has(name)) return;
    let here = m;
    const t = el.getAttribute('transform');
    if (t) {
      try {
        here = compose(m, parseTransform(t));
      } catch (error) {
        if (error instanceof TransformSyntaxError) throw new ImportError('malformed', `${describe(el)}: ${error.message}`);
        throw error;
      }
    }
    if (hidden(el)) {
      this.skipped.push({ entity: describe(el), at: null, reason: 'hidden (display: none)' });
      return;
    }
    if (NOT_DRAWN.has(name)) {
      if (el.childNodes.length > 0) this.skipped.push({ entity: describe(el), at: null, reason: 'definitions are not drawn; references to them are not followed' });
      return;
    }
    if (CONTAINERS.has(name)) {
      if (name === 'svg' && depth > 0) here = compose(here, [1, 0, 0, 1, userLength(el.getAttribute('x')), userLength(el.getAttribute('y'))]);
      const inner = layer ?? layerOf(el);
      for (let c = el.firstChild; c; c = c.nextSibling) if (c.nodeType === 1) this.walk(c as unknown as Element, here, inner, depth + 1);
      return;
    }
    const segs = this.shape(el, name, here);
    if (segs === null) return;
    for (const chain of segs) {
      if (layer === 'ports') this.portChains.push({ el, chain });
      else if (layer === 'wall-zones') this.zoneChains.push({ el, chain });
      else this.chains.push(chain);
    }
  }

  /** The element's chains (metres), or null when it draws nothing we use (reported). */
  private shape(el: Element, name: string, m: Affine): Chain[] | null {
    const source = describe(el);
    const len = (a: string, fallback = 0) => {
      const v = userLength(el.getAttribute(a), fallback);
      checkRaw(v, `${source} ${a}`);
      return v;
    };
    const chain = (segments: Segment[]): Chain[] => {
      this.count(segments.length);
      return segments.length ? [{ source, segments }] : [];
    };
    const points = (closed: boolean): Chain[] => {
      const v = numbers(el.getAttribute('points') ?? '', `${source} points`);
      if (v.length % 2 !== 0 || v.length < 4) throw new ImportError('malformed', `${source} needs an even number of at least 4 coordinates in points`);
      const d = `M${v.slice(0, 2).join(' ')}L${v.slice(2).join(' ')}${closed ? 'Z' : ''}`;
      return this.path(d, m, source);
    };
    switch (name) {
      case 'path':
        return this.path(el.getAttribute('d') ?? '', m, source);
      case 'polygon':
        return points(true);
      case 'polyline':
        return points(false);
      case 'line':
        return this.path(`M${len('x1')} ${len('y1')}L${len('x2')} ${len('y2')}`, m, source);
      case 'rect': {
        const x = len('x'), y = len('y'), w = len('width'), h = len('height');
        if (!(w > 0 && h > 0)) return this.skip(source, this.at(m, [x, y]), 'a rectangle without width or height');
        let rx = el.hasAttribute('rx') ? len('rx') : NaN, ry = el.hasAttribute('ry') ? len('ry') : NaN;
        if (Number.isNaN(rx)) rx = Number.isNaN(ry) ? 0 : ry;
        if (Number.isNaN(ry)) ry = rx;
        rx = Math.min(Math.max(rx, 0), w / 2);
        ry = Math.min(Math.max(ry, 0), h / 2);
        const d = rx > 0 && ry > 0
          ? `M${x + rx} ${y}H${x + w - rx}A${rx} ${ry} 0 0 1 ${x + w} ${y + ry}V${y + h - ry}A${rx} ${ry} 0 0 1 ${x + w - rx} ${y + h}` +
            `H${x + rx}A${rx} ${ry} 0 0 1 ${x} ${y + h - ry}V${y + ry}A${rx} ${ry} 0 0 1 ${x + rx} ${y}Z`
          : `M${x} ${y}H${x + w}V${y + h}H${x}Z`;
        return this.path(d, m, source);
      }
      case 'circle': {
        const r = len('r');
        if (!(r > 0)) return this.skip(source, this.at(m, [len('cx'), len('cy')]), 'a circle without a radius');
        return chain(mappedCircleArc(m, len('cx'), len('cy'), r, 0, 2 * Math.PI));
      }
      case 'ellipse': {
        const rx = len('rx'), ry = len('ry');
        if (!(rx > 0 && ry > 0)) return this.skip(source, this.at(m, [len('cx'), len('cy')]), 'an ellipse without both radii');
        if (Math.abs(rx - ry) <= 1e-12 * rx) return chain(mappedCircleArc(m, len('cx'), len('cy'), rx, 0, 2 * Math.PI));
        const segs = mappedEllipse(m, len('cx'), len('cy'), rx, ry, 0, 0, 2 * Math.PI);
        segs[segs.length - 1] = { ...segs[segs.length - 1], b: segs[0].a };
        return chain(segs);
      }
      case 'text':
        return this.skip(source, this.at(m, [len('x'), len('y')]), `text ("${(el.textContent ?? '').trim().slice(0, 40)}") is not part of an outline`);
      case 'use':
        return this.skip(source, this.at(m, [len('x'), len('y')]), 'references (<use>) are not followed; ungroup or unlink clones before export');
      case 'image':
        return this.skip(source, this.at(m, [len('x'), len('y')]), 'a raster image is not an outline');
      default:
        return this.skip(source, null, 'this kind of element is not supported');
    }
  }

  private skip(entity: string, at: Vec2 | null, reason: string): null {
    this.skipped.push({ entity, at, reason });
    return null;
  }

  private path(d: string, m: Affine, source: string): Chain[] {
    if (d.length > IMPORT_LIMITS.maxPathChars) throw new ImportError('too-large', `${source} has more than ${IMPORT_LIMITS.maxPathChars} characters of path data`);
    let subpaths: Subpath[];
    try {
      subpaths = parsePathData(d, IMPORT_LIMITS.maxSegments);
    } catch (error) {
      if (error instanceof PathSyntaxError) throw new ImportError('malformed', `${source}: ${error.message}`);
      throw error;
    }
    const out: Chain[] = [];
    subpaths.forEach((sp, k) => {
      const segments: Segment[] = [];
      for (const raw of sp.segments) {
        for (const p of Object.values(raw)) if (Array.isArray(p)) { checkRaw(p[0], source); checkRaw(p[1], source); }
        segments.push(...mapSegment(raw, m));
      }
      this.count(segments.length);
      if (segments.length === 0) return;
      const name = subpaths.length > 1 ? `${source} part ${k + 1}` : source;
      if (sp.closed) segments[segments.length - 1] = { ...segments[segments.length - 1], b: segments[0].a };
      out.push({ source: name, segments });
    });
    return out;
  }
}

function dataNumber(el: Element, name: string): number | null {
  const v = el.getAttribute(name);
  if (v === null || v.trim() === '' || /^(null|floating|none)$/i.test(v.trim())) return null;
  const n = Number(v);
  return Number.isFinite(n) ? n : null;
}

export function importSvg(text: string, options: SvgImportOptions = {}): ImportedDrawing {
  preScan(text);
  const root = parseXml(text);
  const all = [root, ...Array.from(root.getElementsByTagName('*'))];
  if (all.length > IMPORT_LIMITS.maxElements) throw new ImportError('too-large', `the SVG has ${all.length} elements; at most ${IMPORT_LIMITS.maxElements} are read`);
  checkHostile(all);
  const units = svgUnits(root.getAttribute('width'), root.getAttribute('height'), root.getAttribute('viewBox'), options.scale);
  const s = units.metresPerUnit;
  const rootMap: Affine = [s, 0, 0, -s, 0, 0]; // user units (y down) to metres (y up)
  const w = new Walker();
  w.walk(root, rootMap, null, 0);

  const everything = [...w.chains, ...w.portChains.map((p) => p.chain), ...w.zoneChains.map((z) => z.chain)].flatMap((c) => c.segments);
  const size = everything.reduce((mx, seg) => Math.max(mx, Math.abs(seg.a[0]), Math.abs(seg.a[1]), Math.abs(seg.b[0]), Math.abs(seg.b[1])), 0);
  const tol = Math.max(1e-12, size * 1e-7);
  const joined = joinChains(w.chains, tol);
  const skipped = [...w.skipped];
  for (const c of joined.open) skipped.push({ entity: c.source, at: c.segments[0].a, reason: 'an open outline: its ends meet no other piece, so it encloses no fluid' });

  const ports: DrawingPort[] = [];
  for (const { el, chain } of w.portChains) {
    const segs = chain.segments;
    if (segs.length === 1 && segs[0].kind === 'line') {
      const id = el.getAttribute('data-port') ?? el.getAttribute('id')?.replace(/^port-/, '') ?? undefined;
      ports.push({ id, name: el.getAttribute('data-name') ?? undefined, from: segs[0].a, to: segs[0].b, potential: dataNumber(el, 'data-potential'), pressure: dataNumber(el, 'data-pressure') ?? 0 });
    } else {
      skipped.push({ entity: chain.source, at: segs[0].a, reason: 'in the ports group but not one straight segment' });
    }
  }
  const wallZones: Array<{ loop: Loop; zeta: number }> = [];
  for (const { el, chain } of w.zoneChains) {
    const zeta = dataNumber(el, 'data-zeta');
    if (zeta === null) skipped.push({ entity: chain.source, at: chain.segments[0].a, reason: 'a wall-zone outline without its zeta (data-zeta, volts)' });
    else if (!isClosed(chain, tol) && gap(chain.segments[0].a, chain.segments[chain.segments.length - 1].b) > tol) skipped.push({ entity: chain.source, at: chain.segments[0].a, reason: 'a wall-zone outline that is not closed' });
    else wallZones.push({ loop: chain, zeta });
  }
  return { format: 'svg', metresPerUnit: s, unitsSource: units.source, loops: joined.loops, ports, wallZones, skipped };
}
