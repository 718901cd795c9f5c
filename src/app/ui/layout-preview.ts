import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import type { DesignDocument } from '../core/api-types';
import { displayBox, formatLength, fromDisplay, scaleBarLength, shapePath, toDisplay } from './layout-geometry';

export interface PreviewPin {
  at: [number, number];
  label: string;
}

/**
 * A small, static drawing of a layout: fluid shapes in order (added in the fluid colour, subtracted in the
 * background colour), ports with their ids, optional numbered pins, and a scale bar. Clicking it reports the
 * point in metres when `pickable` is set.
 */
@Component({
  selector: 'osm-layout-preview',
  templateUrl: './layout-preview.html',
  styleUrl: './layout-preview.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LayoutPreview {
  readonly document = input.required<Pick<DesignDocument, 'shapes' | 'ports'>>();
  readonly pins = input<PreviewPin[]>([]);
  readonly pickable = input(false);
  /** Height in CSS pixels; the width follows the container. */
  readonly height = input(160);
  readonly label = input('Layout preview');
  /** A point picked on the drawing, in metres. */
  readonly pick = output<[number, number]>();

  protected readonly view = computed(() => {
    const doc = this.document();
    const box = displayBox(doc);
    if (!box) return null;
    const w = Math.max(box.maxX - box.minX, 1);
    const h = Math.max(box.maxY - box.minY, 1);
    const pad = Math.max(w, h) * 0.06;
    const x = box.minX - pad;
    const y = box.minY - pad;
    const vw = w + 2 * pad;
    const vh = h + 2 * pad + Math.max(w, h) * 0.08; // room for the scale bar
    const bar = scaleBarLength(w);
    return {
      viewBox: `${x} ${y} ${vw} ${vh}`,
      unit: Math.max(vw, vh) / 100, // one hundredth of the drawing, for marks and text
      shapes: doc.shapes.map((s) => ({ d: shapePath(s), add: s.op === 'add' })),
      ports: doc.ports.map((p) => {
        const a = toDisplay(p.from);
        const b = toDisplay(p.to);
        return { id: p.id, x1: a[0], y1: a[1], x2: b[0], y2: b[1], lx: (a[0] + b[0]) / 2, ly: (a[1] + b[1]) / 2 };
      }),
      bar: { x: box.minX, y: box.maxY + pad + Math.max(w, h) * 0.04, length: bar, text: formatLength(bar) },
    };
  });

  protected readonly pinMarks = computed(() =>
    this.pins().map((p) => {
      const [x, y] = toDisplay(p.at);
      return { x, y, label: p.label };
    }),
  );

  protected onClick(event: MouseEvent): void {
    if (!this.pickable()) return;
    const svg = event.currentTarget as SVGSVGElement;
    const ctm = svg.getScreenCTM?.();
    if (!ctm) return;
    const pt = new DOMPoint(event.clientX, event.clientY).matrixTransform(ctm.inverse());
    const [x, y] = fromDisplay([pt.x, pt.y]);
    this.pick.emit([Number(x.toPrecision(6)), Number(y.toPrecision(6))]);
  }
}
