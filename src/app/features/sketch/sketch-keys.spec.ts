import { claimsKey, sketchKeyCommand } from './sketch-keys';

describe('sketch keys', () => {
  const drawing = { readOnly: false, tool: 'select' as const, selected: true };
  const key = (init: KeyboardEventInit) => new KeyboardEvent('keydown', init);

  it('undoes and redoes with Ctrl or Cmd, even when the design is read-only', () => {
    expect(sketchKeyCommand(key({ key: 'z', ctrlKey: true }), drawing)).toEqual({ kind: 'undo' });
    expect(sketchKeyCommand(key({ key: 'Z', metaKey: true, shiftKey: true }), drawing)).toEqual({ kind: 'redo' });
    expect(sketchKeyCommand(key({ key: 'y', ctrlKey: true }), { ...drawing, readOnly: true })).toEqual({ kind: 'redo' });
    expect(sketchKeyCommand(key({ key: 's', ctrlKey: true }), drawing)).toBeNull();
  });

  it('nudges the selection by one snap step, ten with Shift', () => {
    expect(sketchKeyCommand(key({ key: 'ArrowUp' }), drawing)).toEqual({ kind: 'nudge', steps: [0, 1] });
    expect(sketchKeyCommand(key({ key: 'ArrowLeft', shiftKey: true }), drawing)).toEqual({ kind: 'nudge', steps: [-10, 0] });
    expect(sketchKeyCommand(key({ key: 'ArrowLeft' }), { ...drawing, selected: false })).toBeNull();
  });

  it('picks tools by letter, closes freeform with Enter and cancels with Escape', () => {
    expect(sketchKeyCommand(key({ key: 'S' }), drawing)).toEqual({ kind: 'tool', tool: 'straight' });
    expect(sketchKeyCommand(key({ key: 's', shiftKey: true }), drawing)).toBeNull();
    expect(sketchKeyCommand(key({ key: 'Enter' }), { ...drawing, tool: 'freeform' })).toEqual({ kind: 'close' });
    expect(sketchKeyCommand(key({ key: 'Enter' }), drawing)).toBeNull();
    expect(sketchKeyCommand(key({ key: 'Escape' }), { ...drawing, readOnly: true })).toEqual({ kind: 'cancel' });
    expect(sketchKeyCommand(key({ key: 'Delete' }), drawing)).toEqual({ kind: 'delete' });
  });

  it('changes nothing in a read-only design, and leaves keys typed into fields alone', () => {
    expect(sketchKeyCommand(key({ key: 'Delete' }), { ...drawing, readOnly: true })).toBeNull();
    expect(sketchKeyCommand(key({ key: 'b' }), { ...drawing, readOnly: true })).toBeNull();
    const input = document.createElement('input');
    let seen: ReturnType<typeof sketchKeyCommand> | undefined;
    input.addEventListener('keydown', (e) => (seen = sketchKeyCommand(e, drawing)));
    input.dispatchEvent(key({ key: 'Backspace', bubbles: true }));
    expect(seen).toBeNull();
  });

  it('takes the key from the page except for Escape and tool letters', () => {
    expect(claimsKey({ kind: 'undo' })).toBe(true);
    expect(claimsKey({ kind: 'nudge', steps: [1, 0] })).toBe(true);
    expect(claimsKey({ kind: 'cancel' })).toBe(false);
    expect(claimsKey({ kind: 'tool', tool: 'bend' })).toBe(false);
  });
});
