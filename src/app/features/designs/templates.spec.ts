import { parseDesign } from '../../../../shared/design';
// The solver's own geometry checks judge the templates (a test may reach into solver/; the app code does not).
import { discretiseDesign } from '../../../../solver/grid/discretise';
import { DESIGN_TEMPLATES, documentFrom } from './templates';

describe('design templates', () => {
  it('offers blank, straight channel, cross, T, expansion and serpentine', () => {
    expect(DESIGN_TEMPLATES.map((t) => t.id)).toEqual(['blank', 'straight', 'cross', 'tee', 'expansion', 'serpentine']);
  });

  it.each(DESIGN_TEMPLATES.map((t) => [t.id, t] as const))('%s is a valid design document', (_id, template) => {
    const parsed = parseDesign(JSON.parse(JSON.stringify(template.document)));
    expect(parsed.ok ? [] : parsed.errors).toEqual([]);
  });

  it.each(DESIGN_TEMPLATES.filter((t) => t.id !== 'blank').map((t) => [t.id, t] as const))(
    '%s passes the geometry checks: ports on the outline, every piece connected, driven',
    (_id, template) => {
      const result = discretiseDesign(template.document);
      expect(result.problems.filter((p) => p.severity === 'error')).toEqual([]);
      expect(result.problems.map((p) => p.code)).not.toContain('thin-sliver');
      expect(result.ok).toBe(true);
    },
  );

  it('the blank layout is refused by the checks only for being empty', () => {
    const blank = DESIGN_TEMPLATES.find((t) => t.id === 'blank')!;
    const codes = discretiseDesign(blank.document).problems.map((p) => p.code);
    expect(codes).toContain('empty-layout');
  });

  it('documentFrom gives a renamed copy and leaves the template alone', () => {
    const cross = DESIGN_TEMPLATES.find((t) => t.id === 'cross')!;
    const doc = documentFrom(cross, 'Injector B');
    doc.ports[0].potential = 999;
    expect(doc.name).toBe('Injector B');
    expect(cross.document.name).toBe('Cross injector');
    expect(cross.document.ports[0].potential).toBe(200);
  });
});
