import { describe, expect, it } from 'vitest';
import { tabIndexAfterKey } from '../../renderer/src/support/tabKeys.ts';

// WAI-ARIA Authoring Practices, tabs pattern: arrow keys move between tabs and wrap.
describe('tab list arrow keys', () => {
  it('steps right and left with wrap-around', () => {
    expect(tabIndexAfterKey('ArrowRight', 0, 3)).toBe(1);
    expect(tabIndexAfterKey('ArrowRight', 2, 3)).toBe(0);
    expect(tabIndexAfterKey('ArrowLeft', 0, 3)).toBe(2);
    expect(tabIndexAfterKey('ArrowLeft', 2, 3)).toBe(1);
  });

  it('ignores other keys and empty lists', () => {
    expect(tabIndexAfterKey('Enter', 1, 3)).toBeNull();
    expect(tabIndexAfterKey('ArrowRight', 0, 0)).toBeNull();
  });
});
