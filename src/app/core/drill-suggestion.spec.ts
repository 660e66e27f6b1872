import { TestBed } from '@angular/core/testing';
import { DrillSuggestion } from './drill-suggestion';

describe('DrillSuggestion', () => {
  let s: DrillSuggestion;
  beforeEach(() => {
    s = TestBed.inject(DrillSuggestion);
  });

  it('keeps a valid suggestion from query parameters', () => {
    s.offer('lofted', '38.5', '3');
    expect(s.pending()).toEqual({ technique: 'lofted', targetDistanceM: 38.5, targetRadiusM: 3 });
    s.clear();
    expect(s.pending()).toBeNull();
  });

  it('ignores parameters that do not make a drill', () => {
    s.offer('volley', '38', '3');
    s.offer('lofted', '-2', '3');
    s.offer('lofted', '38', 'x');
    s.offer(undefined, '38', '3');
    expect(s.pending()).toBeNull();
  });
});
