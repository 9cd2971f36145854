import type { KitModel } from '@/db/contracts';

/**
 * A kit model's design data as a form holds it (the kit's own edit form, a study's kit block): the
 * optional cruise speed is left out rather than null, as an empty number field is.
 */
export const kitDesignValues = (kit: KitModel) => ({
  weightLb: kit.weightLb,
  wingAreaSqFt: kit.wingAreaSqFt,
  meanChordIn: kit.meanChordIn,
  stallSpeedKeas: kit.stallSpeedKeas,
  cruiseSpeedKeas: kit.cruiseSpeedKeas ?? undefined,
  category: kit.category,
});
