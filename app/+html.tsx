import { ScrollViewStyleReset } from 'expo-router/html';
import type { PropsWithChildren } from 'react';

/**
 * The web document for web output "static". With output "single" (app.json, what we ship) Expo reads
 * public/index.html instead; the two carry the same head (phone viewport, manifest, theme colour,
 * home-screen icon), so switching the output keeps the app installable.
 */
export default function Root({ children }: PropsWithChildren) {
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta httpEquiv="X-UA-Compatible" content="IE=edge" />
        <meta name="viewport" content="width=device-width, initial-scale=1, viewport-fit=cover" />
        <meta name="description" content="Shop travelers and rivet inspection for kit-built aircraft" />
        <meta name="theme-color" content="#1C1A16" />
        <link rel="manifest" href="/manifest.webmanifest" />
        <link rel="apple-touch-icon" href="/icons/apple-touch-icon.png" />
        <title>Pitchcard</title>
        <ScrollViewStyleReset />
        <style dangerouslySetInnerHTML={{ __html: 'body { background-color: #F3EEE2; }' }} />
      </head>
      <body>{children}</body>
    </html>
  );
}
