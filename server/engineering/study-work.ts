import type { AirfoilGeometry } from './airfoil';
import { STUDY_BUDGET } from './bounds';
import { EngineeringInputError } from './errors';
import { layoutRules } from './layout';
import { pitchGridSize } from './pitch-schedule';
import { lineStationCount } from './rib-geometry';
import type { FastenerLineInput, RivetSpec, ScheduleSettings, StudyWork } from '../../lib/engineering-results';
import { countText } from '../../lib/number-text';

/** A study's cost counted from its input before it runs (`StudyWork`), and the budget each count is held to. */

export interface StudyWorkInput extends ScheduleSettings {
  rib: { chordIn: number };
  lines: FastenerLineInput[];
  gaugeCandidates: number[];
}

export function estimateStudyWork(
  input: StudyWorkInput,
  geometry: AirfoilGeometry,
  rivets: RivetSpec[],
  conditions: number,
  stationStepIn: number,
): StudyWork & { lineLengthsIn: number[] } {
  const lines = input.lines.map((l) => lineStationCount(geometry, l, input.rib.chordIn, stationStepIn));
  const stations = lines.reduce((n, l) => n + l.count, 0);
  const candidates = input.gaugeCandidates.length * rivets.length;
  const pitchGrid = Math.max(...rivets.map((r) => pitchGridSize(input, r.nominalDiameterIn)));
  const holesPerGauge = rivets.reduce((n, r) => {
    const minPitch = layoutRules(r).minPitchIn;
    return n + lines.reduce((m, l) => m + Math.ceil(l.lengthIn / minPitch) + 2, 0);
  }, 0);
  return {
    stations,
    conditions,
    candidates,
    pitchGrid,
    gridCells: stations * pitchGrid,
    stationChecks: stations * conditions * candidates,
    holes: holesPerGauge * input.gaugeCandidates.length,
    lineLengthsIn: lines.map((l) => l.lengthIn),
  };
}

/** The longer of the two candidate lists: the one to shorten to bring a product down the most. */
function candidateField(input: StudyWorkInput, rivetCount: number): string {
  if (input.gaugeCandidates.length * rivetCount <= 1) return 'rib.chordIn';
  return input.gaugeCandidates.length >= rivetCount ? 'gaugeCandidates' : 'rivetCandidates';
}

/** Refuses a study over its budget, naming the field that drives the count that is over. */
export function requireStudyBudget(
  input: StudyWorkInput,
  work: StudyWork & { lineLengthsIn: number[] },
  rivetCount: number,
): void {
  if (work.stations > STUDY_BUDGET.stations) {
    const total = work.lineLengthsIn.reduce((a, b) => a + b, 0);
    const nominal = input.lines.reduce((a, l) => a + (l.endXc - l.startXc) * input.rib.chordIn, 0);
    // Lines far longer than their share of the chord mean a wavy outline, not a large rib.
    const wavy = total > 3 * nominal + input.rib.chordIn;
    throw new EngineeringInputError(
      wavy ? 'airfoil.points' : 'rib.chordIn',
      `the fastener lines run ${countText(total)} in along the surface, ${countText(work.stations)} load stations; at most ${countText(STUDY_BUDGET.stations)}: ` +
        (wavy
          ? `the outline's surface is ${(total / nominal).toFixed(0)} times as long as its chord: smooth the coordinates`
          : 'use a smaller chord, or fewer or shorter lines'),
    );
  }
  if (work.gridCells > STUDY_BUDGET.gridCells) {
    const fewer = Math.max(2, Math.floor(STUDY_BUDGET.gridCells / work.stations));
    const increment = ((work.pitchGrid - 1) * input.pitchIncrementIn) / (fewer - 1);
    throw new EngineeringInputError(
      'pitchIncrementIn',
      `${countText(work.stations)} load stations × ${countText(work.pitchGrid)} pitches is ${countText(work.gridCells)} look-ups; at most ${countText(STUDY_BUDGET.gridCells)}: use an increment of at least ${(Math.ceil(increment * 1000) / 1000).toFixed(3)} in`,
    );
  }
  if (work.stationChecks > STUDY_BUDGET.stationChecks) {
    throw new EngineeringInputError(
      candidateField(input, rivetCount),
      `${countText(work.stations)} load stations × ${work.conditions} conditions × ${work.candidates} candidates is ${countText(work.stationChecks)} checks; at most ${countText(STUDY_BUDGET.stationChecks)}: study fewer gauges or rivets at once`,
    );
  }
  if (work.holes > STUDY_BUDGET.holes) {
    throw new EngineeringInputError(
      candidateField(input, rivetCount),
      `${work.candidates} candidates could place up to ${countText(work.holes)} holes in all; at most ${countText(STUDY_BUDGET.holes)}: study fewer gauges or rivets at once, or fewer or shorter lines`,
    );
  }
}
