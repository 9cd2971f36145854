import { Platform } from 'react-native';

/** What decides whether the scanner can use the camera, read once from the browser (or the phone app). */
export type CameraSetting = {
  platform: string;
  /** `window.isSecureContext` on the web: https, or localhost on the same machine. */
  secureContext: boolean;
  /** Whether the browser offers `navigator.mediaDevices.getUserMedia` at all. */
  canCapture: boolean;
  /** The address the page was opened at (`location.origin`), named in the message. */
  origin: string;
};

/**
 * Why the camera cannot start here before anyone asks for it, in words for the builder; null when it
 * can. Browsers hide the camera entirely outside a secure context, and the permission request then
 * fails as if the person had said no: the cause is the plain-http address, so that is what we say,
 * with the way to the https address. The short code beside the scanner works either way.
 */
export function cameraUnavailableReason(s: CameraSetting): string | null {
  if (s.platform !== 'web') return null;
  if (!s.secureContext) {
    return (
      `The camera works only on Pitchcard's secure address, one starting with https://, and this page is open at ${s.origin || 'a plain http:// address'}. ` +
      'Ask whoever runs Pitchcard to start it in network mode, then open the https:// address it shows (as a QR code on its page for phones). ' +
      'Until then, type the short code printed on the label.'
    );
  }
  if (!s.canCapture) return 'This browser cannot use the camera. Type the short code printed on the label instead.';
  return null;
}

/** What to say when the camera permission was asked for and not given. */
export function cameraRefusedMessage(p: { canAskAgain: boolean }): string {
  return p.canAskAgain
    ? 'The camera was not allowed. Tap “Scan a label” to ask again, or type the short code printed on the label.'
    : 'The camera is blocked for Pitchcard. Allow it in the settings, or type the short code printed on the label.';
}

/** The setting of this device, read from the browser on the web. */
export function currentCameraSetting(): CameraSetting {
  if (Platform.OS !== 'web' || typeof window === 'undefined')
    return { platform: Platform.OS, secureContext: true, canCapture: true, origin: '' };
  return {
    platform: 'web',
    // Browsers before secure contexts existed have no flag; they also had no such camera rule.
    secureContext: window.isSecureContext !== false,
    canCapture: typeof navigator !== 'undefined' && typeof navigator.mediaDevices?.getUserMedia === 'function',
    origin: window.location?.origin ?? '',
  };
}
