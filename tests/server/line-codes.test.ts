import { keepLineCodes } from '@/server/studies/line-codes';

const line = (code: string, name: string, surface = 'upper') => ({ code, name, surface });

describe('fastener line codes from revision to revision', () => {
  it('keeps the old code of a line matched by name, else by its place on the same surface', () => {
    const before = [line('U', 'Upper flange'), line('L', 'Lower flange', 'lower')];
    expect(
      keepLineCodes(before, [line('UF', 'Upper flange'), line('LF', 'Lower flange', 'lower')]).map((l) => l.code),
    ).toEqual(['U', 'L']);
    // Renamed lines are matched by place on their surface.
    expect(
      keepLineCodes(before, [line('UC', 'Upper cap'), line('LC', 'Lower cap', 'lower')]).map((l) => l.code),
    ).toEqual(['U', 'L']);
  });

  it('gives a new line the study’s code, never one an old line keeps, and never the same code twice', () => {
    const before = [line('U', 'Upper flange'), line('UF', 'Upper forward', 'upper')];
    // A name match wins over a place match: "Upper forward" keeps UF though "Upper aft" now sits in its place.
    expect(
      keepLineCodes(before, [line('UF', 'Upper flange'), line('UA', 'Upper aft'), line('UF', 'Upper forward')]).map(
        (l) => l.code,
      ),
    ).toEqual(['U', 'UA', 'UF']);
    // A new line whose own code an old line keeps is numbered.
    expect(
      keepLineCodes([line('U', 'Upper flange')], [line('UF', 'Upper flange'), line('U', 'Upper aft')]).map(
        (l) => l.code,
      ),
    ).toEqual(['U', 'U2']);
    expect(keepLineCodes([], [line('UF', 'Upper flange')]).map((l) => l.code)).toEqual(['UF']);
  });
});
