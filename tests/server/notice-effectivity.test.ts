/**
 * The effectivity rule of a notice on its own (db/contracts/notices.ts): the serial range is inclusive at
 * both ends and compares numbers of the same stem (common practice for kit serial effectivity), a named
 * revision reaches only parts made from it, and "built or not yet built" splits on recorded work.
 */
import { buildInEffect, inSerialRange, partInEffect, serialParts, type NoticeEffectivity } from '@/db/contracts';

const rib = '00000000-0000-4000-8000-000000000001';
const skin = '00000000-0000-4000-8000-000000000002';
const every: NoticeEffectivity = { serialFrom: null, serialTo: null, parts: [], reaches: 'all' };

describe('serial ranges', () => {
  it('splits a serial into its stem and number', () => {
    expect(serialParts('NK2-0147')).toEqual({ stem: 'NK2-', n: 147 });
    expect(serialParts('nk2-147')).toEqual({ stem: 'NK2-', n: 147 });
    expect(serialParts('NK2-A')).toBeNull();
  });

  it.each([
    ['NK2-0149', false],
    ['NK2-0150', true],
    ['NK2-0155', true],
    ['NK2-0160', true],
    ['NK2-0161', false],
    ['XK-0155', false],
    ['NK2-01550', false],
  ])('%s in NK2-0150 … NK2-0160: %s', (serial, inside) => {
    expect(inSerialRange(serial, 'NK2-0150', 'NK2-0160')).toBe(inside);
  });

  it('takes every serial when no range is given', () => {
    expect(inSerialRange('anything', null, null)).toBe(true);
  });
});

describe('parts, revisions and recorded work', () => {
  const named: NoticeEffectivity = { ...every, parts: [{ partDesignId: rib, letters: ['A'] }] };

  it('reaches a named design only at the named revision', () => {
    expect(partInEffect(named, { partDesignId: rib, letter: 'A', started: false })).toBe(true);
    expect(partInEffect(named, { partDesignId: rib, letter: 'B', started: false })).toBe(false);
    expect(partInEffect(named, { partDesignId: skin, letter: 'A', started: false })).toBe(false);
  });

  it('splits on recorded work', () => {
    const started = { ...every, reaches: 'started' as const };
    const fresh = { ...every, reaches: 'not_started' as const };
    expect(partInEffect(started, { partDesignId: rib, letter: 'A', started: true })).toBe(true);
    expect(partInEffect(started, { partDesignId: rib, letter: 'A', started: false })).toBe(false);
    expect(partInEffect(fresh, { partDesignId: rib, letter: 'A', started: false })).toBe(true);
    expect(partInEffect(fresh, { partDesignId: rib, letter: 'A', started: true })).toBe(false);
  });

  it('reaches a build through its parts, or as a whole when the notice names no part', () => {
    const parts = [{ partDesignId: rib, letter: 'B', started: false }];
    expect(buildInEffect(named, 'NK2-0150', parts)).toBeNull();
    expect(buildInEffect(every, 'NK2-0150', [])).toEqual([]);
    expect(buildInEffect({ ...every, reaches: 'started' }, 'NK2-0150', parts)).toBeNull();
    expect(buildInEffect({ ...every, serialFrom: 'NK2-1', serialTo: 'NK2-9' }, 'NK2-0150', parts)).toBeNull();
  });
});
