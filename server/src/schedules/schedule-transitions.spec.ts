import { SCHEDULE_STATES, type ScheduleState } from '@morrowline/shared';
import { stateAfter, transitionRefusal, type ScheduleAction } from './schedule-transitions';

const at = (state: ScheduleState) => ({ state, revision: 2, zone: 'NORTH', operatingDay: '2026-03-08' });

/** Every action and the states it may start from, written out by hand from the workflow. */
const allowed: Record<ScheduleAction, ScheduleState[]> = {
  adjust: ['draft', 'returned'],
  undo: ['draft', 'returned'],
  submit: ['draft', 'returned'],
  return: ['submitted'],
  approve: ['submitted'],
  supersede: ['published'],
};

describe('schedule transitions', () => {
  for (const [action, from] of Object.entries(allowed) as [ScheduleAction, ScheduleState[]][]) {
    for (const state of SCHEDULE_STATES) {
      const ok = from.includes(state);
      it(`${action} from ${state} is ${ok ? 'allowed' : 'refused'}`, () => {
        const refusal = transitionRefusal(action, at(state));
        if (ok) expect(refusal).toBeNull();
        else expect(refusal).toEqual(expect.stringContaining(`${state}`));
      });
    }
  }

  it('moves draft → submitted → published → superseded, and submitted → returned → submitted', () => {
    expect(stateAfter('submit', 'draft')).toBe('submitted');
    expect(stateAfter('approve', 'submitted')).toBe('published');
    expect(stateAfter('supersede', 'published')).toBe('superseded');
    expect(stateAfter('return', 'submitted')).toBe('returned');
    expect(stateAfter('submit', 'returned')).toBe('submitted');
  });

  it('keeps the state when adjusting or undoing', () => {
    expect(stateAfter('adjust', 'draft')).toBe('draft');
    expect(stateAfter('undo', 'returned')).toBe('returned');
  });

  it('tells an operator that a submitted revision must be returned first', () => {
    expect(transitionRefusal('adjust', at('submitted'))).toBe('Cannot adjust revision 2 of NORTH 2026-03-08: it is submitted; a supervisor must return it first');
    expect(transitionRefusal('undo', at('published'))).toBe(
      'Cannot undo an adjustment of revision 2 of NORTH 2026-03-08: it is published and cannot be changed; a change is a correction (a new revision)',
    );
  });

  it('tells a supervisor why a revision cannot be returned or approved', () => {
    expect(transitionRefusal('return', at('draft'))).toBe('Only a submitted schedule can be returned; revision 2 of NORTH 2026-03-08 is draft');
    expect(transitionRefusal('approve', at('published'))).toBe('Revision 2 of NORTH 2026-03-08 is already published; it cannot be changed');
    expect(transitionRefusal('approve', at('returned'))).toBe('Revision 2 of NORTH 2026-03-08 is returned; it must be submitted before it is approved');
  });
});
