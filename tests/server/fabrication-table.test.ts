/**
 * The fabrication-and-assembly table, against sums worked by hand. The split of the builder's work into
 * fabrication and assembly follows the trade's usual reading of the words (making a piece vs joining
 * pieces: common practice); inspections are credited to nobody.
 */
import { creditOf, fabricationTable, type FabricationStep } from '@/db/contracts';

const part = (partNumber: string, steps: FabricationStep[]) => ({
  travelerId: partNumber,
  partNumber,
  partName: partNumber,
  serial: `K-${partNumber}`,
  steps,
});
const s = (kind: FabricationStep['kind'], by: FabricationStep['by'], done = true): FabricationStep => ({
  kind,
  done,
  by,
});

describe('the fabrication-and-assembly table', () => {
  it('credits each done step to one column', () => {
    expect(creditOf('drill', 'builder')).toBe('builder_fabrication');
    expect(creditOf('prime', null)).toBe('builder_fabrication');
    expect(creditOf('rivet', 'builder')).toBe('builder_assembly');
    expect(creditOf('other', 'builder')).toBe('builder_assembly');
    expect(creditOf('drill', 'kit_supplier')).toBe('kit_supplier');
    expect(creditOf('rivet', 'commercial')).toBe('commercial');
    expect(creditOf('inspect', 'builder')).toBeNull();
  });

  it('sums a build of two parts (worked by hand)', () => {
    // Rib: drill (builder), deburr (helper), rivet (builder), rivet (commercial), inspect (builder), prime not done.
    //   credited: fab 1, asm 1, helper 1, commercial 1 → 4; builder 2/4 = 0.5; 1 inspection; 1 not done.
    // Skin: lay out and drill by the kit supplier (pre-punched), dimple (builder), rivet ×2 (builder).
    //   credited: kit 2, fab 1, asm 2 → 5; builder 3/5 = 0.6.
    // Build: fab 2, asm 3, helper 1, commercial 1, kit 2 → 9; builder 5/9 = 0.5556 (not the mean of 0.5 and 0.6).
    const t = fabricationTable([
      part('W-104', [
        s('drill', 'builder'),
        s('deburr', 'helper'),
        s('rivet', 'builder'),
        s('rivet', 'commercial'),
        s('inspect', 'builder'),
        s('prime', null, false),
      ]),
      part('W-201', [
        s('lay_out', 'kit_supplier'),
        s('drill', 'kit_supplier'),
        s('dimple_countersink', 'builder'),
        s('rivet', 'builder'),
        s('rivet', 'builder'),
      ]),
    ]);
    expect(t.parts[0]).toMatchObject({
      credited: { builder_fabrication: 1, builder_assembly: 1, helper: 1, commercial: 1, kit_supplier: 0 },
      creditedTotal: 4,
      inspections: 1,
      notDone: 1,
      builderShare: 0.5,
    });
    expect(t.parts[1]).toMatchObject({
      credited: { builder_fabrication: 1, builder_assembly: 2, helper: 0, commercial: 0, kit_supplier: 2 },
      creditedTotal: 5,
      builderShare: 0.6,
    });
    expect(t.total).toMatchObject({
      credited: { builder_fabrication: 2, builder_assembly: 3, helper: 1, commercial: 1, kit_supplier: 2 },
      creditedTotal: 9,
      inspections: 1,
      notDone: 1,
    });
    expect(t.total.builderShare).toBeCloseTo(5 / 9, 12);
  });

  it('has no share before any step is credited', () => {
    const t = fabricationTable([part('W-105', [s('inspect', 'builder'), s('rivet', 'builder', false)])]);
    expect(t.parts[0]).toMatchObject({ creditedTotal: 0, inspections: 1, notDone: 1, builderShare: null });
    expect(fabricationTable([]).total.builderShare).toBeNull();
  });
});
