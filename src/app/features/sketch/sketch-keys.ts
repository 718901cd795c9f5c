/**
 * The keyboard of the Sketch tab: what a key means given the tool in use, whether there is a selection and
 * whether the design may be edited. Keys typed into a field belong to the field.
 */
import { toolByKey, type ToolId } from './sketch-tools';
import type { Vec } from './tool-geometry';

export type SketchKeyCommand =
  | { kind: 'undo' }
  | { kind: 'redo' }
  /** Escape: drop the points or drag in progress, else go back to Select, else clear the selection. */
  | { kind: 'cancel' }
  | { kind: 'delete' }
  /** Enter in Freeform: close the polygon. */
  | { kind: 'close' }
  /** Arrow keys: move the selection by this many snap steps (ten with Shift). */
  | { kind: 'nudge'; steps: Vec }
  | { kind: 'tool'; tool: ToolId };

const ARROWS: Record<string, Vec> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, 1], ArrowDown: [0, -1] };

export function sketchKeyCommand(e: KeyboardEvent, context: { readOnly: boolean; tool: ToolId; selected: boolean }): SketchKeyCommand | null {
  const target = e.target as HTMLElement | null;
  if (target?.closest('input, textarea, select, [contenteditable], mat-select, .mat-mdc-select')) return null;
  const mod = e.ctrlKey || e.metaKey;
  const key = e.key.toLowerCase();
  if (mod && key === 'z') return { kind: e.shiftKey ? 'redo' : 'undo' };
  if (mod && key === 'y') return { kind: 'redo' };
  if (mod || e.altKey) return null;
  if (e.key === 'Escape') return { kind: 'cancel' };
  if (context.readOnly) return null;
  if (e.key === 'Delete' || e.key === 'Backspace') return { kind: 'delete' };
  if (e.key === 'Enter' && context.tool === 'freeform') return { kind: 'close' };
  const arrow = ARROWS[e.key];
  if (arrow && context.selected) {
    const times = e.shiftKey ? 10 : 1;
    return { kind: 'nudge', steps: [arrow[0] * times, arrow[1] * times] };
  }
  const tool = toolByKey(key);
  return tool && !e.shiftKey ? { kind: 'tool', tool: tool.id } : null;
}

/** Whether the command takes the key from the page (undo in the browser, scrolling, going back). */
export function claimsKey(command: SketchKeyCommand): boolean {
  return command.kind !== 'cancel' && command.kind !== 'tool';
}
