import { ChangeDetectionStrategy, Component, computed, effect, input, linkedSignal, output, signal, untracked, viewChild } from '@angular/core';
import { ReactiveFormsModule, type FormControl } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { DesignDocument, Port, Shape } from '../../../../shared/design';
import { quantityControl, quantityError, readQuantity } from '../../ui/quantity-validator';
import { formatQuantity } from '../../ui/units';
import type { CanvasPointer, DragMode, Selection, SketchPreview } from './canvas-pointer';
import { emptyHistory, record, redo, undo, type History } from './design-history';
import { liveProblemsOf } from './live-checks';
import { nextPortId, portSegmentNear, sameSegment } from './port-placement';
import { ShapeInspector } from './shape-inspector';
import { attachedPorts, draggedDocument, nudgedDocument, type Drag } from './shape-drag';
import { shapePivot } from './shape-transform';
import { fluidOutlineOf } from '../../core/instant-client';
import { SketchCanvas } from './sketch-canvas';
import { claimsKey, sketchKeyCommand } from './sketch-keys';
import { TOOLS, type ToolId } from './sketch-tools';
import { JUNCTION_KINDS, chamberFromCorners, directionDeg, freeformPolygon, type JunctionKind, type Vec } from './tool-geometry';
import { DEFAULT_TOOL_SETTINGS, TOOL_SETTING_RULES, toolClick, toolPreview, type ToolSettings, type ToolState } from './tool-steps';

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
  private readonly settings = signal<ToolSettings>(DEFAULT_TOOL_SETTINGS);
  protected readonly straightWidth = this.settingControl('straightWidth');
  protected readonly bendWidth = this.settingControl('bendWidth');
  protected readonly junctionLeg = this.settingControl('junctionLeg');
  protected readonly junctionWidth = this.settingControl('junctionWidth');
  protected readonly junctionAngle = this.settingControl('junctionAngle');
  protected readonly pillarRadius = this.settingControl('pillarRadius');
  protected readonly junctionKind = signal<JunctionKind>('tee');

  /** What the drawing shows: the drag in progress, or the document. */
  protected readonly shown = computed(() => this.draft() ?? this.doc());
  protected readonly outline = fluidOutlineOf(() => this.shown().shapes);
  /** Live validation, a moment after the last change. */
  protected readonly problems = liveProblemsOf(() => this.doc());
  protected readonly errorCount = computed(() => this.problems().filter((p) => p.severity === 'error').length);

  protected readonly dragMode = computed<DragMode>(() => {
    if (this.readOnly()) return 'pan-anywhere';
    const t = this.tool();
    return t === 'select' ? 'pan-empty' : t === 'chamber' ? 'draw' : 'pan-anywhere';
  });

  protected readonly preview = computed<SketchPreview | null>(() => (this.readOnly() ? null : toolPreview(this.toolState(), this.hover(), (world) => this.portSegmentAt(world))));

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
  }

  /** The field of one tool setting; every valid value typed in goes into the settings. */
  private settingControl(key: keyof ToolSettings): FormControl<string> {
    const rule = TOOL_SETTING_RULES[key];
    const control = quantityControl(DEFAULT_TOOL_SETTINGS[key], rule);
    control.valueChanges.subscribe((text) => {
      const r = readQuantity(text, rule);
      if (r.ok) this.settings.update((s) => ({ ...s, [key]: r.value }));
    });
    return control;
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

  private nudge(dx: number, dy: number): void {
    const sel = this.selection();
    if (!sel || this.readOnly()) return;
    this.commit(nudgedDocument(this.doc(), sel, dx, dy));
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

  private portSegmentAt(world: Vec) {
    return portSegmentNear(this.outline(), world, PICK_PIXELS * this.metresPerPixel());
  }

  private toolState(): ToolState {
    return { tool: this.tool(), points: this.points(), chamberStart: this.chamberStart(), settings: this.settings(), junctionKind: this.junctionKind() };
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
        this.drag = { kind: 'rotate', index: sel.index, pivot, startAngle: directionDeg(pivot, p.world), base: doc, ports: attachedPorts(doc, sel.index) };
        this.canvas()?.capture(p.event);
        return;
      }
      this.selectHit(p);
      if (p.hit?.kind === 'shape') {
        this.drag = { kind: 'move', index: p.hit.index, start: p.snapped, base: doc, ports: attachedPorts(doc, p.hit.index) };
        this.canvas()?.capture(p.event);
      }
      return;
    }
    const drag = this.drag;
    if (!drag || drag.kind === 'chamber') return;
    if (p.type === 'move') {
      this.draft.set(draggedDocument(drag, { snapped: p.snapped, world: p.world, free: p.event.altKey }));
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
    if (this.tool() === 'port') return this.placePort(p.world);
    const step = toolClick(this.toolState(), p.snapped, p.event.shiftKey, PICK_PIXELS * this.metresPerPixel());
    if (step.close) return this.closeFreeform();
    if (step.points) this.points.set(step.points);
    if (step.shapes) this.addShapes(step.shapes);
    if (step.notice) this.notice.set(step.notice);
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
    const command = sketchKeyCommand(e, { readOnly: this.readOnly(), tool: this.tool(), selected: this.selection() !== null });
    if (!command) return;
    if (claimsKey(command)) e.preventDefault();
    switch (command.kind) {
      case 'undo':
        return this.undo();
      case 'redo':
        return this.redo();
      case 'cancel':
        return this.cancel();
      case 'delete':
        return this.deleteSelection();
      case 'close':
        return this.closeFreeform();
      case 'nudge': {
        const step = this.canvas()?.snapStep() ?? 1e-5;
        return this.nudge(command.steps[0] * step, command.steps[1] * step);
      }
      case 'tool':
        return this.setTool(command.tool);
    }
  }

  /** Escape: drops the points or drag in progress, else goes back to Select, else clears the selection. */
  private cancel(): void {
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
  }
}
