import type * as s from './schema';

export type UserRow = typeof s.users.$inferSelect;
export type KitModelRow = typeof s.kitModels.$inferSelect;
export type PartDesignRow = typeof s.partDesigns.$inferSelect;
export type RevisionRow = typeof s.designRevisions.$inferSelect;
export type BuildRow = typeof s.builds.$inferSelect;
export type TravelerRow = typeof s.travelers.$inferSelect;
export type HoleRow = typeof s.holes.$inferSelect;
export type FindingRow = typeof s.findings.$inferSelect;
export type FindingEventRow = typeof s.findingEvents.$inferSelect;
