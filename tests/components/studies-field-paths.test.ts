import { normaliseFieldPath, studyFieldFor } from '@/components/studies/study-form-values';

describe('server field paths of a study, put back on the form', () => {
  it('spells an engine path and a zod path for the same field the same way', () => {
    expect(normaliseFieldPath('kit.weightLb')).toBe('inputs.kit.weightLb');
    expect(normaliseFieldPath('inputs.kit.weightLb')).toBe('inputs.kit.weightLb');
  });

  it('turns the engine’s bracketed indices into the form’s dotted ones', () => {
    expect(normaliseFieldPath('lines[0].endXc')).toBe('inputs.lines.0.endXc');
    expect(normaliseFieldPath('inputs.lines.0.endXc')).toBe('inputs.lines.0.endXc');
    expect(normaliseFieldPath('gaugeCandidates[12]')).toBe('inputs.gaugeCandidates.12');
  });

  it('leaves the study’s own name and kit model where they are, outside the inputs', () => {
    expect(normaliseFieldPath('name')).toBe('name');
    expect(normaliseFieldPath('kitModelId')).toBe('kitModelId');
  });

  it('puts an airfoil complaint on the coordinates, whichever point it names', () => {
    expect(studyFieldFor('airfoil.points')).toBe('inputs.airfoil.points');
    expect(studyFieldFor('inputs.airfoil.points.3.1')).toBe('inputs.airfoil.points');
    expect(studyFieldFor('airfoil.points[40]')).toBe('inputs.airfoil.points');
  });

  it('says a complaint about one chosen gauge or rivet on the chips they were chosen with', () => {
    expect(studyFieldFor('gaugeCandidates[2]')).toBe('inputs.gaugeCandidates');
    expect(studyFieldFor('inputs.rivetCandidates.0')).toBe('inputs.rivetCandidates');
  });

  it('puts a line’s complaint on that line’s field, and one about the whole line on its name', () => {
    expect(studyFieldFor('lines[1].startXc')).toBe('inputs.lines.1.startXc');
    expect(studyFieldFor('lines[1].name')).toBe('inputs.lines.1.name');
    expect(studyFieldFor('lines[1]')).toBe('inputs.lines.1.name');
    expect(studyFieldFor('lines')).toBe('inputs.lines');
  });

  it('places the schedule settings and the kit data on their fields', () => {
    expect(studyFieldFor('pitchIncrementIn')).toBe('inputs.pitchIncrementIn');
    expect(studyFieldFor('maxPitchDiameters')).toBe('inputs.maxPitchDiameters');
    expect(studyFieldFor('kit.cruiseSpeedKeas')).toBe('inputs.kit.cruiseSpeedKeas');
    expect(studyFieldFor('rib.chordIn')).toBe('inputs.rib.chordIn');
  });

  it('has no place for what the form does not show, so it is said at the top', () => {
    expect(studyFieldFor('coupons[0].loadLb')).toBeNull();
    expect(studyFieldFor('input')).toBeNull();
    expect(studyFieldFor('kit.liftSlopePerRad')).toBe('inputs.kit.liftSlopePerRad');
    expect(studyFieldFor('wingTorqueInLb')).toBeNull();
    expect(studyFieldFor('cellAreaSqIn')).toBeNull();
  });
});
