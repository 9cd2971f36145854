import { lazyScreen } from '@/components/navigation/lazy-screen';

// Every study page asks for the same module (./screens), so the web export keeps the studies in one chunk.
const screens = () => import('./screens');

export const StudiesScreen = lazyScreen('Studies', () => screens().then((m) => m.StudiesScreen));
export const StudyScreen = lazyScreen('The study', () => screens().then((m) => m.StudyScreen));
export const NewStudyScreen = lazyScreen('A new study', () => screens().then((m) => m.NewStudyScreen));
export const NewWingStudyScreen = lazyScreen('A new wing study', () => screens().then((m) => m.NewWingStudyScreen));
