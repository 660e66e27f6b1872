import { canonicalLocale, parseDecimal, QuantityFormat } from '../../shared/quantity-format';
import { distanceToM, METRES_PER_YARD, metresTo } from '../../shared/units';

describe('Club units and locale formatting', () => {
  it('converts yards by the exact international yard', () => {
    // International yard and pound agreement (1959): 1 yd = 0.9144 m exactly.
    expect(METRES_PER_YARD).toBe(0.9144);
    expect(distanceToM(100, 'yd')).toBeCloseTo(91.44, 12);
    expect(metresTo(91.44, 'yd')).toBeCloseTo(100, 12);
    expect(metresTo(31.4, 'm')).toBe(31.4);
  });

  it('writes a carry with the locale’s decimal mark and the club’s unit', () => {
    // CLDR: German uses a decimal comma, British English a point.
    expect(new QuantityFormat({ locale: 'de-DE', distanceUnit: 'yd' }).distance(27.432)).toBe('30,0 yd');
    expect(new QuantityFormat({ locale: 'en-GB', distanceUnit: 'm' }).distance(31.44)).toBe('31.4 m');
    expect(new QuantityFormat({ locale: 'de-DE', distanceUnit: 'm' }).distanceRange(28, 33.5)).toBe('28,0–33,5 m');
    expect(new QuantityFormat({ locale: 'en-GB', distanceUnit: 'yd' }).round(30)).toBe('32.8 yd');
  });

  it('keeps the 24-hour clock where the locale uses it and 12 hours where it does not', () => {
    const at = new Date(2026, 2, 3, 18, 30);
    // CLDR time formats: de-DE and en-GB write 18:30; en-US writes 6:30 PM.
    expect(new QuantityFormat({ locale: 'de-DE', distanceUnit: 'm' }).time(at)).toBe('18:30');
    expect(new QuantityFormat({ locale: 'en-GB', distanceUnit: 'm' }).time(at)).toBe('18:30');
    expect(new QuantityFormat({ locale: 'en-US', distanceUnit: 'm' }).time(at)).toMatch(/06:30\sPM/);
  });

  it('writes days in the locale’s order and knows its first day of the week', () => {
    // CLDR: "3. März 2026" in German, "3 Mar 2026" in British English; weeks start Monday in both, Sunday in the US.
    expect(new QuantityFormat({ locale: 'de-DE', distanceUnit: 'm' }).day('2026-03-03', true)).toBe('3. März 2026');
    expect(new QuantityFormat({ locale: 'en-GB', distanceUnit: 'm' }).day('2026-03-03', true)).toBe('3 Mar 2026');
    expect(new QuantityFormat({ locale: 'de-DE', distanceUnit: 'm' }).firstDayOfWeek()).toBe(1);
    expect(new QuantityFormat({ locale: 'en-US', distanceUnit: 'm' }).firstDayOfWeek()).toBe(7);
  });

  it('accepts BCP 47 tags in canonical form and refuses what is not one', () => {
    expect(canonicalLocale('de-de')).toBe('de-DE');
    expect(canonicalLocale('not a locale')).toBeNull();
    expect(new QuantityFormat({ locale: 'xx--', distanceUnit: 'm' }).locale).toBe('en-GB');
  });

  it('reads a typed decimal with either mark', () => {
    expect(parseDecimal('31,5')).toBe(31.5);
    expect(parseDecimal(' 31.5 ')).toBe(31.5);
    expect(parseDecimal('')).toBeNull();
    expect(Number.isNaN(parseDecimal('abc'))).toBeTrue();
  });
});
