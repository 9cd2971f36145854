import {
  editableNumber,
  formatDiameters,
  formatForce,
  formatLength,
  formatMass,
  formatWingLoading,
  fromDisplay,
  lengthNumber,
  parseNumber,
  toDisplay,
} from '@/constants/units';

describe('units formatting', () => {
  it('says wing loading in kg/m² on the metric switch', () => {
    expect(formatWingLoading(11, 'imperial')).toBe('11.0 psf');
    // 1 lb/ft² = 0.45359237 kg / 0.09290304 m² = 4.88243 kg/m² (the pound and foot's exact definitions, NIST SP 811 appendix B).
    expect(formatWingLoading(11, 'metric')).toBe('53.7 kg/m²');
    expect(formatWingLoading(20, 'metric')).toBe('97.6 kg/m²');
  });

  it('shows a sheet gauge in inches with three places', () => {
    expect(formatLength(0.032, 'imperial')).toBe('0.032 in');
    expect(formatLength(0.025, 'imperial')).toBe('0.025 in');
  });

  it('keeps the fourth place a drill diameter needs', () => {
    expect(formatLength(0.1285, 'imperial')).toBe('0.1285 in');
  });

  it('shows longer lengths in inches with two places', () => {
    expect(formatLength(3.75, 'imperial')).toBe('3.75 in');
    expect(formatLength(48, 'imperial')).toBe('48.00 in');
  });

  it('converts lengths to millimetres on the metric switch', () => {
    expect(formatLength(0.032, 'metric')).toBe('0.81 mm');
    expect(formatLength(1, 'metric')).toBe('25.4 mm');
    expect(formatLength(48, 'metric')).toBe('1219 mm');
  });

  it('shows forces in pounds, or in newtons on the metric switch', () => {
    expect(formatForce(100, 'imperial')).toBe('100 lb');
    expect(formatForce(12.34, 'imperial')).toBe('12.3 lb');
    expect(formatForce(100, 'metric')).toBe('445 N');
  });

  it('shows a weight in kilograms on the metric switch', () => {
    expect(formatMass(1320, 'metric')).toBe('599 kg');
  });

  it('converts there and back without drift', () => {
    expect(fromDisplay('length', toDisplay('length', 0.1285, 'metric'), 'metric')).toBeCloseTo(0.1285, 12);
    expect(fromDisplay('force', toDisplay('force', 250, 'metric'), 'metric')).toBeCloseTo(250, 12);
  });

  it('writes diameters ratios with one place', () => {
    expect(formatDiameters(2.4444)).toBe('2.4 D');
  });

  it('shows a dash for a missing number instead of NaN', () => {
    expect(lengthNumber(Number.NaN, 'imperial')).toBe('–');
  });
});

describe('reading typed numbers', () => {
  it('takes a point or a comma as the decimal mark', () => {
    expect(parseNumber('0.032')).toBe(0.032);
    expect(parseNumber('0,81')).toBe(0.81);
    expect(parseNumber(' .5 ')).toBe(0.5);
  });

  it('treats an empty field as no number and words as not a number', () => {
    expect(parseNumber('')).toBeUndefined();
    expect(parseNumber('abc')).toBeNaN();
    expect(parseNumber('1.2.3')).toBeNaN();
  });

  it('shows a stored inch value in millimetres for editing without noise digits', () => {
    expect(editableNumber('length', 0.032, 'metric')).toBe('0.8128');
    expect(editableNumber('length', 0.032, 'imperial')).toBe('0.032');
    expect(editableNumber('length', undefined, 'imperial')).toBe('');
  });
});
