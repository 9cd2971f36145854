import { oversizeOptions } from '@/server/findings/oversize-options';

describe('the oversize rivets offered for a rework', () => {
  it('are the next two sizes of the same family, the length dash of a callout ignored', () => {
    // Solid rivet sizes 3, 4, 5, 6, 8 (3/32 … 1/4 in) of MS20470/MS20426: common practice.
    expect(oversizeOptions('MS20470AD4')?.map((o) => o.code)).toEqual(['MS20470AD5', 'MS20470AD6']);
    expect(oversizeOptions('MS20470AD4-4')?.map((o) => o.code)).toEqual(['MS20470AD5', 'MS20470AD6']);
    expect(oversizeOptions('MS20470AD6')?.map((o) => o.code)).toEqual(['MS20470AD8']);
    expect(oversizeOptions('MS20426AD5')?.map((o) => o.code)).toEqual(['MS20426AD6']);
    expect(oversizeOptions('PULLED-4-CSK')?.map((o) => o.code)).toEqual(['PULLED-5-CSK', 'PULLED-6-CSK']);
    expect(oversizeOptions('pulled-3')?.map((o) => o.code)).toEqual(['PULLED-4', 'PULLED-5']);
  });

  it('are none at the top of a family, and unknown for a rivet outside the catalogue', () => {
    expect(oversizeOptions('MS20470AD8')).toEqual([]);
    expect(oversizeOptions('CR3213-4')).toBeNull();
  });
});
