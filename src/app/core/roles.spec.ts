import { canComment, canEdit, reviewTransitions } from './roles';

describe('roles', () => {
  it('lets editors and owners change designs; reviewers and up comment', () => {
    expect(['viewer', 'reviewer', 'editor', 'owner'].map((r) => canEdit(r as never))).toEqual([false, false, true, true]);
    expect(['viewer', 'reviewer', 'editor', 'owner'].map((r) => canComment(r as never))).toEqual([false, true, true, true]);
    expect(canEdit(null)).toBe(false);
  });

  it('offers the review moves each role may make', () => {
    const moves = (role: string, state: string) => reviewTransitions(role as never, state as never).map((t) => t.to);
    expect(moves('viewer', 'draft')).toEqual([]);
    expect(moves('editor', 'draft')).toEqual(['in review']);
    expect(moves('editor', 'in review')).toEqual(['draft']);
    expect(moves('reviewer', 'in review')).toEqual(['mask-ready', 'draft']);
    expect(moves('owner', 'in review')).toEqual(['mask-ready', 'draft']);
    expect(moves('reviewer', 'mask-ready')).toEqual(['draft']);
    expect(moves('owner', 'draft')).toEqual(['in review']);
  });
});
