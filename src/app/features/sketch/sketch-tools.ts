/** The sketch tools: our names (product.md), icons, keyboard shortcuts and what each one asks of the engineer. */
export type ToolId = 'select' | 'straight' | 'bend' | 'junction' | 'chamber' | 'pillar' | 'freeform' | 'port';

export interface ToolInfo {
  id: ToolId;
  label: string;
  /** Material Symbols name. */
  icon: string;
  /** Keyboard shortcut (a letter, shown upper-case). */
  key: string;
  /** One line on how to use it, shown in the tooltip and under the toolbar. */
  how: string;
}

export const TOOLS: readonly ToolInfo[] = [
  { id: 'select', label: 'Select', icon: 'arrow_selector_tool', key: 'v', how: 'Click a shape or port to select it; drag to move; drag the round handle to turn; Del deletes.' },
  { id: 'straight', label: 'Straight', icon: 'horizontal_rule', key: 's', how: 'Click the start of the centre line, then its end.' },
  { id: 'bend', label: 'Bend', icon: 'turn_left', key: 'b', how: 'Click the centre of the bend, then the start of its centre line, then where it turns to.' },
  { id: 'junction', label: 'Junction', icon: 'call_split', key: 'j', how: 'Click where the legs meet.' },
  { id: 'chamber', label: 'Chamber', icon: 'crop_square', key: 'c', how: 'Drag from one corner to the opposite corner.' },
  { id: 'pillar', label: 'Pillar', icon: 'radio_button_unchecked', key: 'o', how: 'Click where the pillar stands; it is cut out of the fluid.' },
  { id: 'freeform', label: 'Freeform', icon: 'polyline', key: 'f', how: 'Click the corners in order; double-click, Enter or a click on the first point closes; Esc cancels.' },
  { id: 'port', label: 'Port', icon: 'input', key: 'p', how: 'Click the outline where a channel meets its reservoir (a channel end).' },
];

export function toolByKey(key: string): ToolInfo | undefined {
  return TOOLS.find((t) => t.key === key.toLowerCase());
}
