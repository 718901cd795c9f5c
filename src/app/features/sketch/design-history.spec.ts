import { emptyHistory, record, redo, undo } from './design-history';

describe('design history', () => {
  it('undoes and redoes edits in order', () => {
    let h = emptyHistory<string>();
    let doc = 'a';
    for (const next of ['b', 'c']) {
      h = record(h, doc);
      doc = next;
    }
    let step = undo(h, doc)!;
    expect(step.state).toBe('b');
    step = undo(step.history, step.state)!;
    expect(step.state).toBe('a');
    expect(undo(step.history, step.state)).toBeNull();
    const again = redo(step.history, step.state)!;
    expect(again.state).toBe('b');
    expect(redo(again.history, again.state)!.state).toBe('c');
  });

  it('forgets the redo branch after a new edit', () => {
    let h = record(emptyHistory<string>(), 'a');
    const back = undo(h, 'b')!;
    h = record(back.history, back.state);
    expect(redo(h, 'x')).toBeNull();
    expect(undo(h, 'x')!.state).toBe('a');
  });

  it('keeps at most the limit of past states', () => {
    let h = emptyHistory<number>();
    for (let k = 0; k < 10; k++) h = record(h, k, 4);
    expect(h.past).toEqual([6, 7, 8, 9]);
  });
});
