import { ScrollViewStyleReset } from 'expo-router/html';
import type { PropsWithChildren } from 'react';

/** The app's faces, as public/index.html declares them (WOFF2 subsets made by scripts/make-fonts.mjs). */
const fontFaces = [
  'AtkinsonHyperlegible_400Regular',
  'AtkinsonHyperlegible_700Bold',
  'IBMPlexMono_400Regular',
  'IBMPlexMono_600SemiBold',
]
  .map(
    (family) =>
      `@font-face { font-family: ${family}; src: url(/fonts/${family}.woff2) format("woff2"); font-display: swap; }`,
  )
  .join('\n');

/**
 * The web document for web output "static". With output "single" (app.json, what we ship) Expo reads
 * public/index.html instead; the two carry the same head (phone viewport, manifest, theme colour,
 * home-screen icon, the fonts), so switching the output keeps the app installable.
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
        <link
          rel="preload"
          href="/fonts/AtkinsonHyperlegible_400Regular.woff2"
          as="font"
          type="font/woff2"
          crossOrigin=""
        />
        <link
          rel="preload"
          href="/fonts/AtkinsonHyperlegible_700Bold.woff2"
          as="font"
          type="font/woff2"
          crossOrigin=""
        />
        <style id="app-fonts" dangerouslySetInnerHTML={{ __html: fontFaces }} />
        <ScrollViewStyleReset />
        <style dangerouslySetInnerHTML={{ __html: 'body { background-color: #F3EEE2; }' }} />
      </head>
      <body>{children}</body>
    </html>
  );
}
