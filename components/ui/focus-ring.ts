import { Platform } from 'react-native';
import { colors } from '@/constants/theme';

let installed = false;

/**
 * Our own keyboard focus ring, on everything focusable (our controls, the tab bar, links, fields):
 * the browser's own was a thin dark ring, 1.1:1 on a chosen (black) chip. A 3 px ring in the focus
 * cobalt (3.4:1 on the ink, 4.4:1 on the paper), 2 px out from the control, and a paper-white band
 * filling that gap, so the ring reads on the paper, on the ink and on an accent-filled button alike.
 * `:focus-visible` keeps it to keyboard use (and to fields, where a caret needs it too); a tap does not
 * leave a ring behind. Installed once, by the shared primitives that make focusable things.
 */
export function installFocusRing(): void {
  if (installed || Platform.OS !== 'web' || typeof document === 'undefined') return;
  installed = true;
  const style = document.createElement('style');
  style.setAttribute('data-pitchcard', 'focus-ring');
  style.textContent = [
    ':focus-visible {',
    `  outline: 3px solid ${colors.focus} !important;`,
    '  outline-offset: 2px !important;',
    `  box-shadow: 0 0 0 2px ${colors.paperRaised} !important;`,
    '}',
    // A heading or notice given focus so that a screen reader starts there is not a control: a quiet
    // underline-like ring, so a sighted keyboard user still sees where they are.
    '[tabindex="-1"]:focus-visible {',
    '  outline-width: 2px !important;',
    '}',
  ].join('\n');
  document.head.appendChild(style);
}
