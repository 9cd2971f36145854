import { ScrollViewStyleReset } from 'expo-router/html';
import type { PropsWithChildren } from 'react';

/**
 * The web document. Note: with web output "single" (app.json) Expo uses its own index.html and this
 * file applies only if the output becomes "static"; the viewport there is the same phone viewport.
 */
export default function Root({ children }: PropsWithChildren) {
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta httpEquiv="X-UA-Compatible" content="IE=edge" />
        <meta name="viewport" content="width=device-width, initial-scale=1, viewport-fit=cover" />
        <meta name="theme-color" content="#F3EEE2" />
        <title>Pitchcard</title>
        <ScrollViewStyleReset />
        <style dangerouslySetInnerHTML={{ __html: 'body { background-color: #F3EEE2; }' }} />
      </head>
      <body>{children}</body>
    </html>
  );
}
