import { ChangeDetectionStrategy, Component, computed, effect, inject, input, linkedSignal, output, signal, untracked, viewChild } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { DesignDocument, DesignProblem, Port, Shape } from '../../../../shared/design';
import { quantityControl, quantityError, readQuantity, type QuantityRule } from '../../ui/quantity-validator';
import { formatQuantity } from '../../ui/units';
import { emptyHistory, record, redo, undo, type History } from './design-history';
import { GEOMETRY_CHECKS } from './live-checks';
import { nextPortId, portSegmentNear, sameSegment } from './port-placement';
import { ShapeInspector } from './shape-inspector';
import { portsOnShape, rotatePort, rotateShape, shapeBounds, shapePivot, translatePort, translateShape, wrapAngle } from './shape-transform';
import { fluidOutlineOf } from '../../core/instant-client';
import { SketchCanvas, type CanvasPointer, type DragMode, type Selection, type SketchPreview } from './sketch-canvas';
import { TOOLS, toolByKey, type ToolId } from './sketch-tools';
import { snapAngle } from './snap';
import {
  JUNCTION_KINDS,
  bendFromPoints,
  chamberFromCorners,
  directionDeg,
  freeformPolygon,
  junctionShapes,
  pillarAt,
  straightChannel,
  type JunctionKind,
  type Vec,
} from './tool-geometry';

type Drag =
  | { kind: 'move'; index: number; start: Vec; base: DesignDocument; ports: number[] }
  | { kind: 'rotate'; index: number; pivot: Vec; startAngle: number; base: DesignDocument; ports: number[] }
  | { kind: 'chamber'; start: Vec };

/** Pointer distance (screen px) within which the Port tool finds the outline and Freeform closes. */
const PICK_PIXELS = 10;

/**
 * The Sketch tab: draw the channel layout with the tools, edit exact dimensions in the side panel, undo and
 * redo, and see the geometry checks live. Emits a new design document on every committed edit.
 */
@Component({
  selector: 'osm-sketch-editor',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatTooltipModule,
    SketchCanvas,
    ShapeInspector,
  ],
  templateUrl: './sketch-editor.html',
  styleUrl: './sketch-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '(keydown)': 'onKey($event)' },
})
export class SketchEditor {
  readonly document = input.required<DesignDocument>();
  readonly readOnly = input(false);
  readonly documentChange = output<DesignDocument>();

  private readonly checks = inject(GEOMETRY_CHECKS);
  protected readonly tools = TOOLS;
  protected readonly junctionKinds = JUNCTION_KINDS;
  private readonly canvas = viewChild(SketchCanvas);

  /** The document as edited here; follows the input when the page gives a new one. */
  protected readonly doc = linkedSignal(() => this.document());
  private readonly history = signal<History<DesignDocument>>(emptyHistory());
  private lastEmitted: DesignDocument | null = null;
  protected readonly canUndo = computed(() => !this.readOnly() && this.history().past.length > 0);
  protected readonly canRedo = computed(() => !this.readOnly() && this.history().future.length > 0);

  protected readonly tool = signal<ToolId>('select');
  protected readonly toolInfo = computed(() => TOOLS.find((t) => t.id === this.tool())!);
  protected readonly selection = signal<Selection | null>(null);
  private readonly points = signal<Vec[]>([]);
  private readonly hover = signal<CanvasPointer | null>(null);
  private readonly draft = signal<DesignDocument | null>(null);
  private readonly chamberStart = signal<Vec | null>(null);
  private drag: Drag | null = null;
  protected readonly notice = signal('');

  // ---- tool settings, typed with units
  private readonly lengthRule: QuantityRule = { dimension: 'length', defaultUnit: 'um', min: 0, minExclusive: true };
  protected readonly straightWidth = quantityControl(5e-5, this.lengthRule);
  protected readonly bendWidth = quantityControl(5e-5, this.lengthRule);
  protected readonly junctionLeg = quantityControl(5e-4, this.lengthRule);
  protected readonly junctionWidth = quantityControl(5e-5, this.lengthRule);
  protected readonly junctionAngle = quantityControl(0, { dimension: 'angle', defaultUnit: 'deg' });
  protected readonly pillarRadius = quantityControl(2.5e-5, this.lengthRule);
  protected readonly junctionKind = signal<JunctionKind>('tee');
  private readonly settings = signal({ straightWidth: 5e-5, bendWidth: 5e-5, junctionLeg: 5e-4, junctionWidth: 5e-5, junctionAngle: 0, pillarRadius: 2.5e-5 });

  /** What the drawing shows: the drag in progress, or the document. */
  protected readonly shown = computed(() => this.draft() ?? this.doc());
  protected readonly outline = fluidOutlineOf(() => this.shown().shapes);
  protected readonly problems = signal<DesignProblem[]>([]);
  protected readonly errorCount = computed(() => this.problems().filter((p) => p.severity === 'error').length);

  protected readonly dragMode = computed<DragMode>(() => {
    if (this.readOnly()) return 'pan-anywhere';
    const t = this.tool();
    return t === 'select' ? 'pan-empty' : t === 'chamber' ? 'draw' : 'pan-anywhere';
  });

  protected readonly preview = computed<SketchPreview | null>(() => this.buildPreview());

  protected readonly cursorText = computed(() => {
    const h = this.hover();
    if (!h) return '';
    const p = h.snapped;
    return `x ${formatQuantity(p[0], 'length', { digits: 5 })} · y ${formatQuantity(p[1], 'length', { digits: 5 })}`;
  });
  protected readonly gridText = computed(() => {
    const c = this.canvas();
    return c ? formatQuantity(c.snapStep(), 'length', { digits: 3 }) : '';
  });

  constructor() {
    // A document from outside (another tab, a reload, a conflict resolved) starts a fresh history.
    effect(() => {
      const incoming = this.document();
      untracked(() => {
        if (incoming === this.lastEmitted) return;
        this.history.set(emptyHistory());
        this.draft.set(null);
        this.points.set([]);
        this.drag = null;
        this.keepSelectionValid();
      });
    });
    // Live validation, a moment after the last change.
    effect((onCleanup) => {
      const doc = this.doc();
      const timer = setTimeout(() => {
        Promise.resolve(this.checks(doc)).then(
          (problems) => {
            if (this.doc() === doc) this.problems.set(problems);
          },
          () => undefined,
        );
      }, 200);
      onCleanup(() => clearTimeout(timer));
    });
    const bind = (control: typeof this.straightWidth, key: keyof ReturnType<typeof this.settings>, rule: QuantityRule) =>
      control.valueChanges.subscribe((text) => {
        const r = readQuantity(text, rule);
        if (r.ok) this.settings.update((s) => ({ ...s, [key]: r.value }));
      });
    bind(this.straightWidth, 'straightWidth', this.lengthRule);
    bind(this.bendWidth, 'bendWidth', this.lengthRule);
    bind(this.junctionLeg, 'junctionLeg', this.lengthRule);
    bind(this.junctionWidth, 'junctionWidth', this.lengthRule);
    bind(this.junctionAngle, 'junctionAngle', { dimension: 'angle', defaultUnit: 'deg' });
    bind(this.pillarRadius, 'pillarRadius', this.lengthRule);
  }

  protected fieldError(control: typeof this.straightWidth): string {
    return quantityError(control);
  }

  protected blurOnEnter(event: Event): void {
    (event.target as HTMLElement).blur();
  }

  // ---------------------------------------------------------------- edits

  private commit(next: DesignDocument, select?: Selection | null): void {
    const before = this.doc();
    if (next === before) return;
    this.history.update((h) => record(h, before));
    this.setDoc(next);
    if (select !== undefined) this.selection.set(select);
    this.notice.set('');
  }

  private setDoc(next: DesignDocument): void {
    this.doc.set(next);
    this.lastEmitted = next;
    this.documentChange.emit(next);
  }

  private addShapes(shapes: Shape[]): void {
    const doc = this.doc();
    this.commit({ ...doc, shapes: [...doc.shapes, ...shapes] }, { kind: 'shape', index: doc.shapes.length });
  }

  protected undo(): void {
    if (!this.canUndo()) return;
    const step = undo(this.history(), this.doc());
    if (!step) return;
    this.history.set(step.history);
    this.setDoc(step.state);
    this.keepSelectionValid();
  }

  protected redo(): void {
    if (!this.canRedo()) return;
    const step = redo(this.history(), this.doc());
    if (!step) return;
    this.history.set(step.history);
    this.setDoc(step.state);
    this.keepSelectionValid();
  }

  private keepSelectionValid(): void {
    const sel = this.selection();
    const doc = this.doc();
    if (sel && !(sel.kind === 'shape' ? doc.shapes[sel.index] : doc.ports[sel.index])) this.selection.set(null);
  }

  protected deleteSelection(): void {
    const sel = this.selection();
    if (!sel || this.readOnly()) return;
    const doc = this.doc();
    if (sel.kind === 'shape') this.commit({ ...doc, shapes: doc.shapes.filter((_s, k) => k !== sel.index) }, null);
    else this.commit({ ...doc, ports: doc.ports.filter((_p, k) => k !== sel.index) }, null);
  }

  protected onShapeChange(e: { index: number; shape: Shape }): void {
    const doc = this.doc();
    this.commit({ ...doc, shapes: doc.shapes.map((s, k) => (k === e.index ? e.shape : s)) });
  }

  protected onPortChange(e: { index: number; port: Port }): void {
    const doc = this.doc();
    this.commit({ ...doc, ports: doc.ports.map((p, k) => (k === e.index ? e.port : p)) });
  }

  private attachedPorts(doc: DesignDocument, index: number): number[] {
    const shape = doc.shapes[index];
    const b = shapeBounds(shape);
    return portsOnShape(shape, doc.ports, 1e-9 + 1e-7 * Math.max(b[2] - b[0], b[3] - b[1]));
  }

  private nudge(dx: number, dy: number): void {
    const sel = this.selection();
    if (!sel || this.readOnly()) return;
    const doc = this.doc();
    if (sel.kind === 'shape') {
      const ports = this.attachedPorts(doc, sel.index);
      this.commit({
        ...doc,
        shapes: doc.shapes.map((s, k) => (k === sel.index ? translateShape(s, dx, dy) : s)),
        ports: doc.ports.map((p, k) => (ports.includes(k) ? translatePort(p, dx, dy) : p)),
      });
    } else {
      this.commit({ ...doc, ports: doc.ports.map((p, k) => (k === sel.index ? translatePort(p, dx, dy) : p)) });
    }
  }

  // ---------------------------------------------------------------- tools

  protected setTool(id: ToolId): void {
    if (this.readOnly()) return;
    this.tool.set(id);
    this.points.set([]);
    this.chamberStart.set(null);
    this.drag = null;
    this.draft.set(null);
    this.notice.set('');
  }

  protected zoom(factor: number): void {
    this.canvas()?.zoomBy(factor);
  }

  protected fit(): void {
    this.canvas()?.fit();
  }

  protected showProblem(index: number): void {
    const p = this.problems()[index];
    if (!p) return;
    const m = /^(shapes|ports)\[(\d+)\]/.exec(p.field ?? '');
    if (m) this.selection.set({ kind: m[1] === 'shapes' ? 'shape' : 'port', index: Number(m[2]) });
    if (p.at) this.canvas()?.centreOn(p.at);
  }

  /** Metres per screen pixel at the current zoom. */
  private metresPerPixel(): number {
    return 1 / (this.canvas()?.pixelsPerMetre() ?? 1e6);
  }

  private constrained(from: Vec, to: Vec, shift: boolean): Vec {
    if (!shift) return to;
    const angle = snapAngle(directionDeg(from, to), 15);
    const len = Math.hypot(to[0] - from[0], to[1] - from[1]);
    const r = (angle * Math.PI) / 180;
    return [from[0] + len * Math.cos(r), from[1] + len * Math.sin(r)];
  }

  private portSegmentAt(world: Vec) {
    return portSegmentNear(this.outline(), world, PICK_PIXELS * this.metresPerPixel());
  }

  private buildPreview(): SketchPreview | null {
    if (this.readOnly()) return null;
    const h = this.hover();
    const pts = this.points();
    const s = this.settings();
    const at = h?.snapped;
    switch (this.tool()) {
      case 'straight': {
        if (pts.length === 0 || !at) return pts.length ? { shapes: [], points: pts } : null;
        const end = this.constrained(pts[0], at, !!h?.event.shiftKey);
        const shape = straightChannel(pts[0], end, s.straightWidth);
        return { shapes: shape ? [shape] : [], points: pts, rubber: [pts[0], end] };
      }
      case 'bend': {
        if (pts.length === 0 || !at) return pts.length ? { shapes: [], points: pts } : null;
        if (pts.length === 1) return { shapes: [], points: pts, rubber: [pts[0], at] };
        const shape = bendFromPoints(pts[0], pts[1], at, s.bendWidth);
        return { shapes: shape ? [shape] : [], points: pts, rubber: [pts[0], at] };
      }
      case 'junction':
        return at ? { shapes: junctionShapes(this.junctionKind(), at, s.junctionLeg, s.junctionWidth, s.junctionAngle), points: [] } : null;
      case 'chamber': {
        const start = this.chamberStart();
        const shape = start && at ? chamberFromCorners(start, at) : null;
        return { shapes: shape ? [shape] : [], points: start ? [start] : [] };
      }
      case 'pillar': {
        const shape = at ? pillarAt(at, s.pillarRadius) : null;
        return shape ? { shapes: [shape], points: [] } : null;
      }
      case 'freeform':
        return pts.length ? { shapes: [], points: pts, rubber: at ? [pts[pts.length - 1], at] : null } : null;
      case 'port':
        return h ? { shapes: [], points: [], segment: this.portSegmentAt(h.world) } : null;
      default:
        return null;
    }
  }

  protected onPointer(p: CanvasPointer): void {
    if (p.type === 'leave') {
      if (!this.drag) this.hover.set(null);
      return;
    }
    this.hover.set(p);
    if (p.hit?.kind === 'problem' && p.type === 'down') {
      this.showProblem(p.hit.index);
      return;
    }
    if (this.readOnly()) {
      if (p.type === 'down') this.selectHit(p);
      return;
    }
    switch (this.tool()) {
      case 'select':
        return this.selectTool(p);
      case 'chamber':
        return this.chamberTool(p);
      default:
        if (p.type === 'click') this.clickTool(p);
        else if (p.type === 'dblclick' && this.tool() === 'freeform') this.closeFreeform();
    }
  }

  private selectHit(p: CanvasPointer): void {
    if (p.hit?.kind === 'shape' || p.hit?.kind === 'port') this.selection.set({ kind: p.hit.kind, index: p.hit.index });
    else if (!p.hit) this.selection.set(null);
  }

  private selectTool(p: CanvasPointer): void {
    const doc = this.doc();
    if (p.type === 'down' && p.event.button === 0) {
      if (p.hit?.kind === 'rotate') {
        const sel = this.selection();
        if (sel?.kind !== 'shape') return;
        const pivot = shapePivot(doc.shapes[sel.index]);
        this.drag = { kind: 'rotate', index: sel.index, pivot, startAngle: directionDeg(pivot, p.world), base: doc, ports: this.attachedPorts(doc, sel.index) };
        this.canvas()?.capture(p.event);
        return;
      }
      this.selectHit(p);
      if (p.hit?.kind === 'shape') {
        this.drag = { kind: 'move', index: p.hit.index, start: p.snapped, base: doc, ports: this.attachedPorts(doc, p.hit.index) };
        this.canvas()?.capture(p.event);
      }
      return;
    }
    const drag = this.drag;
    if (!drag || drag.kind === 'chamber') return;
    if (p.type === 'move') {
      if (drag.kind === 'move') {
        const dx = p.snapped[0] - drag.start[0], dy = p.snapped[1] - drag.start[1];
        this.draft.set(dx === 0 && dy === 0 ? null : {
          ...drag.base,
          shapes: drag.base.shapes.map((s, k) => (k === drag.index ? translateShape(s, dx, dy) : s)),
          ports: drag.base.ports.map((q, k) => (drag.ports.includes(k) ? translatePort(q, dx, dy) : q)),
        });
      } else {
        const raw = directionDeg(drag.pivot, p.world) - drag.startAngle;
        const deg = p.event.altKey ? wrapAngle(raw) : snapAngle(wrapAngle(raw), 5);
        this.draft.set(deg === 0 ? null : {
          ...drag.base,
          shapes: drag.base.shapes.map((s, k) => (k === drag.index ? rotateShape(s, deg, drag.pivot) : s)),
          ports: drag.base.ports.map((q, k) => (drag.ports.includes(k) ? rotatePort(q, deg, drag.pivot) : q)),
        });
      }
    } else if (p.type === 'up') {
      const draft = this.draft();
      this.drag = null;
      this.draft.set(null);
      if (draft) this.commit(draft);
    }
  }

  private chamberTool(p: CanvasPointer): void {
    if (p.type === 'down' && p.event.button === 0) {
      this.chamberStart.set(p.snapped);
      this.drag = { kind: 'chamber', start: p.snapped };
      this.canvas()?.capture(p.event);
    } else if (p.type === 'up' && this.drag?.kind === 'chamber') {
      const shape = chamberFromCorners(this.drag.start, p.snapped);
      this.drag = null;
      this.chamberStart.set(null);
      if (shape) this.addShapes([shape]);
      else this.notice.set('Drag from one corner of the chamber to the opposite corner.');
    }
  }

  private clickTool(p: CanvasPointer): void {
    const s = this.settings();
    const pts = this.points();
    const at = p.snapped;
    switch (this.tool()) {
      case 'straight': {
        if (pts.length === 0) {
          this.points.set([at]);
          return;
        }
        const shape = straightChannel(pts[0], this.constrained(pts[0], at, p.event.shiftKey), s.straightWidth);
        this.points.set([]);
        if (shape) this.addShapes([shape]);
        else this.notice.set('The end is on the start; click the end of the channel somewhere else.');
        return;
      }
      case 'bend': {
        if (pts.length < 2) {
          this.points.set([...pts, at]);
          return;
        }
        const shape = bendFromPoints(pts[0], pts[1], at, s.bendWidth);
        this.points.set([]);
        if (shape) this.addShapes([shape]);
        else this.notice.set('The radius must be more than half the width, and the end must turn away from the start.');
        return;
      }
      case 'junction': {
        const shapes = junctionShapes(this.junctionKind(), at, s.junctionLeg, s.junctionWidth, s.junctionAngle);
        if (shapes.length) this.addShapes(shapes);
        else this.notice.set('The legs must be longer than half their width.');
        return;
      }
      case 'pillar': {
        const shape = pillarAt(at, s.pillarRadius);
        if (shape) this.addShapes([shape]);
        return;
      }
      case 'freeform': {
        const first = pts[0];
        if (first && pts.length >= 3 && Math.hypot(at[0] - first[0], at[1] - first[1]) <= PICK_PIXELS * this.metresPerPixel()) {
          this.closeFreeform();
          return;
        }
        this.points.set([...pts, at]);
        return;
      }
      case 'port':
        return this.placePort(p.world);
    }
  }

  private closeFreeform(): void {
    const result = freeformPolygon(this.points(), 0.5 * this.metresPerPixel());
    if (!result.ok) {
      this.notice.set(result.reason);
      return;
    }
    this.points.set([]);
    this.addShapes([result.shape]);
  }

  private placePort(world: Vec): void {
    const segment = this.portSegmentAt(world);
    if (!segment) {
      this.notice.set('Click on the outline of the fluid, e.g. across the end of a channel.');
      return;
    }
    const doc = this.doc();
    const tolerance = this.metresPerPixel();
    if (doc.ports.some((q) => sameSegment(q, segment, tolerance))) {
      this.notice.set('There is a port there already.');
      return;
    }
    const port: Port = { id: nextPortId(doc.ports), from: segment.from, to: segment.to, potential: 0, pressure: 0 };
    this.commit({ ...doc, ports: [...doc.ports, port] }, { kind: 'port', index: doc.ports.length });
  }

  // ---------------------------------------------------------------- keyboard

  protected onKey(e: KeyboardEvent): void {
    const target = e.target as HTMLElement | null;
    if (target?.closest('input, textarea, select, [contenteditable], mat-select, .mat-mdc-select')) return;
    const mod = e.ctrlKey || e.metaKey;
    const key = e.key.toLowerCase();
    if (mod && key === 'z') {
      e.preventDefault();
      if (e.shiftKey) this.redo();
      else this.undo();
      return;
    }
    if (mod && key === 'y') {
      e.preventDefault();
      this.redo();
      return;
    }
    if (mod || e.altKey) return;
    if (e.key === 'Escape') {
      if (this.points().length || this.drag) {
        this.points.set([]);
        this.chamberStart.set(null);
        this.drag = null;
        this.draft.set(null);
      } else if (this.tool() !== 'select') {
        this.setTool('select');
      } else {
        this.selection.set(null);
      }
      return;
    }
    if (this.readOnly()) return;
    if (e.key === 'Delete' || e.key === 'Backspace') {
      e.preventDefault();
      this.deleteSelection();
      return;
    }
    if (e.key === 'Enter' && this.tool() === 'freeform') {
      e.preventDefault();
      this.closeFreeform();
      return;
    }
    const arrows: Record<string, Vec> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, 1], ArrowDown: [0, -1] };
    if (arrows[e.key] && this.selection()) {
      e.preventDefault();
      const step = (this.canvas()?.snapStep() ?? 1e-5) * (e.shiftKey ? 10 : 1);
      this.nudge(arrows[e.key][0] * step, arrows[e.key][1] * step);
      return;
    }
    const tool = toolByKey(key);
    if (tool && !e.shiftKey) {
      this.setTool(tool.id);
    }
  }
}
