import { describe, expect, it } from 'vitest';
import { useHistory } from '../../renderer/src/composables/useHistory.ts';

describe('useHistory', () => {
  it('undoes and redoes commits in order', () => {
    const h = useHistory('a');
    h.commit('b');
    h.commit('c');
    expect(h.present.value).toBe('c');
    expect(h.undo()).toBe(true);
    expect(h.present.value).toBe('b');
    expect(h.undo()).toBe(true);
    expect(h.present.value).toBe('a');
    expect(h.undo()).toBe(false);
    expect(h.canUndo.value).toBe(false);
    expect(h.redo()).toBe(true);
    expect(h.redo()).toBe(true);
    expect(h.present.value).toBe('c');
    expect(h.redo()).toBe(false);
  });

  it('drops the redo steps when a new edit is made after an undo', () => {
    const h = useHistory(1);
    h.commit(2);
    h.commit(3);
    h.undo();
    h.commit(4);
    expect(h.canRedo.value).toBe(false);
    expect(h.present.value).toBe(4);
    h.undo();
    expect(h.present.value).toBe(2);
  });

  it('folds consecutive commits of one group into one step until sealed', () => {
    const h = useHistory('');
    for (const text of ['1', '12', '120']) h.commit(text, 'legs.2.end.distance_m');
    // The count of steps is the property under test (three keystrokes, one step; common practice in editors).
    expect(h.depth.value.undo).toBe(1);
    h.seal();
    h.commit('1200', 'legs.2.end.distance_m');
    expect(h.depth.value.undo).toBe(2);
    h.undo();
    expect(h.present.value).toBe('120');
    h.undo();
    expect(h.present.value).toBe('');
  });

  it('starts a new step when the group changes', () => {
    const h = useHistory({ a: 0, b: 0 });
    h.commit({ a: 1, b: 0 }, 'a');
    h.commit({ a: 1, b: 1 }, 'b');
    h.undo();
    expect(h.present.value).toEqual({ a: 1, b: 0 });
  });

  it('keeps at most `limit` steps, dropping the oldest', () => {
    const h = useHistory(0, { limit: 3 });
    for (let i = 1; i <= 10; i++) h.commit(i);
    // Limit of 3 steps set above: from 10 only 9, 8, 7 are reachable.
    expect(h.depth.value.undo).toBe(3);
    while (h.undo());
    expect(h.present.value).toBe(7);
  });

  it('reset forgets every step', () => {
    const h = useHistory('x');
    h.commit('y');
    h.reset('z');
    expect(h.present.value).toBe('z');
    expect(h.canUndo.value).toBe(false);
    expect(h.canRedo.value).toBe(false);
  });
});
