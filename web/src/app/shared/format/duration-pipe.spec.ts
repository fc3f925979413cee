import { formatDuration } from './duration-pipe';

describe('formatDuration', () => {
  it('reads like people say it', () => {
    expect(formatDuration(0.004)).toBe('under 0.01 s');
    expect(formatDuration(42)).toBe('42 s');
    expect(formatDuration(200)).toBe('3 min 20 s');
    expect(formatDuration(7500)).toBe('2 h 05 min');
  });
});
