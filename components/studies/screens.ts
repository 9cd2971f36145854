// The studies' screens, for the routes under app/(app)/studies, which load them through this one module
// (components/navigation/lazy-screen.tsx): the studies' forms, tables and plots then make one chunk,
// fetched when a study page first opens, instead of sitting in the chunk every page loads at start.
export { StudiesScreen } from './studies-screen';
export { NewStudyScreen, StudyScreen } from './study-screen';
export { NewWingStudyScreen } from './wing-screen';
