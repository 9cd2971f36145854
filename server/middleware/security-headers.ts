import helmet from 'helmet';
import type { Config } from '../config';

/**
 * helmet with a content security policy the exported Expo web app runs under (checked in Chromium by
 * tests/e2e/security-headers.e2e.ts). The bearer token sits in localStorage, so what matters most is
 * that no script but our own bundle can run: no inline script, no eval, no other origin.
 */
export function securityHeaders(config: Pick<Config, 'env'>) {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        // 'wasm-unsafe-eval' lets the QR reader compile zxing's WebAssembly (served from our origin); it
        // allows no JavaScript eval.
        scriptSrc: ["'self'", "'wasm-unsafe-eval'"],
        scriptSrcAttr: ["'none'"],
        // react-native-web and expo-font write their styles into <style> elements at run time, and the
        // export's index.html carries Expo's inline reset: styles cannot run code, scripts stay strict.
        styleSrc: ["'self'", "'unsafe-inline'"],
        // data: for inline icons, blob: for the photo picker's previews before upload.
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'", 'data:'],
        // The picked photo's data:/blob: URI is fetched back into a Blob for the upload; nothing leaves for another origin.
        connectSrc: ["'self'", 'data:', 'blob:'],
        mediaSrc: ["'self'", 'blob:'],
        // 'self': the service worker (dist/sw.js, made by scripts/build-offline.mjs) that keeps the app
        // working without signal; and the web app manifest, named outright rather than left to default-src.
        workerSrc: ["'self'", 'blob:'],
        manifestSrc: ["'self'"],
        objectSrc: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        // No other site may frame us (clickjacking of sign-in and sign-off); X-Frame-Options below for old browsers.
        frameAncestors: ["'none'"],
      },
    },
    frameguard: { action: 'deny' },
    // Photo links carry a signature and mails carry one-time links: no URL of ours leaves in a Referer.
    referrerPolicy: { policy: 'no-referrer' },
    // HSTS only where TLS is in front of us; on http://localhost or a shop's LAN address it would only confuse.
    strictTransportSecurity: config.env === 'production' ? { maxAge: 180 * 24 * 3600 } : false,
  });
}
