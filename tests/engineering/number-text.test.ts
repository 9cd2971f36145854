import { boundText, countText } from '@/lib/number-text';

// The words of limits: US English digit grouping by threes with a comma (common practice).
describe('numbers in the words of limits', () => {
  it('groups whole counts by thousands and rounds what is not whole', () => {
    expect(countText(0)).toBe('0');
    expect(countText(999)).toBe('999');
    expect(countText(12_500)).toBe('12,500');
    expect(countText(15_000_000)).toBe('15,000,000');
    expect(countText(1234.6)).toBe('1,235');
  });

  it('writes a bound whole and grouped, or to four decimals', () => {
    expect(boundText(1000)).toBe('1,000');
    expect(boundText(0.008)).toBe('0.008');
    expect(boundText(0.123456)).toBe('0.1235');
    expect(boundText(-40)).toBe('-40');
  });
});
