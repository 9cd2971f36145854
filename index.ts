// The app's entry ("main" in package.json): Expo Router's own, after one setting the content security
// policy needs. The web app runs without 'unsafe-eval' (server/middleware/security-headers.ts); zod would
// otherwise probe `new Function('')` on its first parse to decide whether to compile its parsers, and the
// browser refuses and reports that probe as a policy violation. Interpreted parsing is plenty for forms.
import { z } from 'zod';
import { registerServiceWorker } from './lib/service-worker';

z.config({ jitless: true });

// The offline copy of the app (web production builds only; a no-op on native and under jest). Here,
// at the entry, so it installs whatever screen the app opens at.
registerServiceWorker();

// After the setting, hence require rather than a hoisted import.
// eslint-disable-next-line @typescript-eslint/no-require-imports
require('expo-router/entry');

// The app draws on a later task (expo-router renders in a transition): what the page opened at needs
// starts now, meanwhile (components/navigation/early-arrival.web.ts; nothing on a phone).
// eslint-disable-next-line @typescript-eslint/no-require-imports
require('./components/navigation/early-arrival').startEarlyArrival();
