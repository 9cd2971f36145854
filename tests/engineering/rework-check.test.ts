import { EngineeringInputError, reworkCheck, type ReworkInput } from '@/server/engineering';

const hole: ReworkInput = {
  rivetSpec: 'MS20470AD4',
  proposedSpec: 'MS20470AD5',
  holeStationIn: 10,
  neighbourStationsIn: [9, 11],
  edgeDistanceIn: 0.35,
  gaugeIn: 0.032,
  material: '6061-T6',
  appliedLimitTensionLb: 10,
  appliedLimitShearLb: 40,
};

describe('the rework check for an oversize rivet', () => {
  it('passes a hole with room for the next size, and gives the new drill, edge distance and pitch', () => {
    const r = reworkCheck(hole);
    expect(r.pass).toBe(true);
    expect(r.newDrill).toEqual({ name: '#21', diameterIn: 0.159 });
    expect(r.requiredEdgeIn).toBeCloseTo(0.3125, 10);
    expect(r.requiredPitchIn).toBeCloseTo(0.46875, 10);
    expect(r.alternative).toBeNull();
  });

  it('gives the new margins of the larger rivet', () => {
    const r = reworkCheck(hole);
    expect(r.margins.shearUltimate).toBeGreaterThan(0);
    expect(r.margins.combinedLimit).not.toBeNull();
    expect(r.margins.combinedUltimate).toBeGreaterThanOrEqual(0);
  });

  it('fails a hole too close to its neighbour for 3D of the new rivet, and offers a doubler', () => {
    const r = reworkCheck({ ...hole, neighbourStationsIn: [9.6, 11] });
    expect(r.pass).toBe(false);
    expect(r.reasons.join(' ')).toMatch(/pitch to the previous hole 0\.4000 in is less than 3D/);
    expect(r.alternative).toBe('repair with doubler');
  });

  it('fails with scrap when the bigger hole would all but break into the edge', () => {
    const r = reworkCheck({ ...hole, edgeDistanceIn: 0.15 });
    expect(r.pass).toBe(false);
    expect(r.alternative).toBe('scrap');
  });

  it('fails when the loads would overstress the bigger rivet in this flange', () => {
    const r = reworkCheck({ ...hole, gaugeIn: 0.016, appliedLimitTensionLb: 40 });
    expect(r.pass).toBe(false);
    expect(r.reasons.join(' ')).toMatch(/margin of safety/);
  });

  it('asks 2.5D of edge distance for a countersunk rivet', () => {
    const r = reworkCheck({ ...hole, rivetSpec: 'MS20426AD4', proposedSpec: 'MS20426AD5', edgeDistanceIn: 0.35 });
    expect(r.requiredEdgeIn).toBeCloseTo(0.390625, 10);
    expect(r.pass).toBe(false);
  });

  it('checks only the layout, and says so, when no loads are given', () => {
    const { appliedLimitTensionLb, appliedLimitShearLb, ...layoutOnly } = hole;
    void appliedLimitTensionLb;
    void appliedLimitShearLb;
    const r = reworkCheck(layoutOnly);
    expect(r.margins.combinedLimit).toBeNull();
    expect(r.warnings.join(' ')).toMatch(/no applied loads/);
  });

  it('warns when the proposal skips a size', () => {
    expect(
      reworkCheck({
        ...hole,
        proposedSpec: 'MS20470AD6',
        edgeDistanceIn: 0.5,
        neighbourStationsIn: [9, 11],
      }).warnings.join(' '),
    ).toMatch(/skips a size/);
  });

  it('refuses a "next size" that is not larger', () => {
    try {
      reworkCheck({ ...hole, proposedSpec: 'MS20470AD3' });
      throw new Error('expected a refusal');
    } catch (e) {
      expect(e).toBeInstanceOf(EngineeringInputError);
      expect((e as EngineeringInputError).field).toBe('proposedSpec');
    }
  });

  it('carries the caution with its result', () => {
    expect(reworkCheck(hole).caution).toMatch(/aid only/);
  });
});

describe('the rework check at its limits', () => {
  it('passes stations stored as float32 (Math.fround) exactly 3D apart', () => {
    // The database stores stations as `real`; 1.3 reads back as 1.2999999523…, a hair under 3D from 0.83125.
    const [prev, at, next] = [0.83125, 1.3, 1.76875].map(Math.fround);
    const r = reworkCheck({ ...hole, holeStationIn: at, neighbourStationsIn: [prev, next] });
    // pitch ≥ 3D = 0.46875 in for AD5 — FAA AC 43.13-1B ch. 4; met at the limit within half a thousandth
    expect(r.pitchToNeighboursIn[0]).toBeLessThan(0.46875);
    expect(r.pass).toBe(true);
  });

  it('still fails a pitch a thousandth short of 3D', () => {
    // pitch ≥ 3D = 0.46875 in — FAA AC 43.13-1B ch. 4
    expect(reworkCheck({ ...hole, neighbourStationsIn: [10 - 0.4677, 11] }).pass).toBe(false);
  });
});
