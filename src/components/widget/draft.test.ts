import { describe, expect, it } from 'vitest';
import { BUILT_BEFORE_1978_REQUIRED, newDraft, toProject, unansweredQuestions } from './draft';

describe('the "built before 1978" question', () => {
  it('starts unanswered and must be answered before going on', () => {
    const draft = newDraft('imperial');
    expect(draft.builtBefore1978).toBeNull();
    expect(unansweredQuestions(draft)).toEqual({ 'project.builtBefore1978': BUILT_BEFORE_1978_REQUIRED });
    expect(unansweredQuestions({ ...draft, builtBefore1978: 'no' })).toEqual({});
  });

  it('is priced as "not sure" until answered, so the live range never leaves out lead-safe work', () => {
    const draft = { ...newDraft('imperial'), treatmentId: 'board-and-batten' };
    expect(toProject(draft, 'imperial').project?.builtBefore1978).toBe('not-sure');
    expect(toProject({ ...draft, builtBefore1978: 'no' }, 'imperial').project?.builtBefore1978).toBe('no');
  });
});
