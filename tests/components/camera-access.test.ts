import { cameraRefusedMessage, cameraUnavailableReason, type CameraSetting } from '@/components/bench/camera-access';

const web = (s: Partial<CameraSetting>): CameraSetting => ({
  platform: 'web',
  secureContext: true,
  canCapture: true,
  origin: 'https://pitchcard.shop',
  ...s,
});

describe('why the scanner cannot use the camera', () => {
  it('names the https address, and how to get it, on a plain-http shop address instead of blaming a refusal', () => {
    const text = cameraUnavailableReason(
      web({ secureContext: false, canCapture: false, origin: 'http://192.168.1.20:8080' }),
    )!;
    expect(text).toContain('https://');
    expect(text).toContain('http://192.168.1.20:8080');
    expect(text).toMatch(/network mode/);
    expect(text).toMatch(/type the short code/i);
    expect(text).not.toMatch(/not allowed|blocked/i);
  });

  it('says the https address is the cause even when the browser still offers the camera call', () => {
    expect(cameraUnavailableReason(web({ secureContext: false, canCapture: true, origin: 'http://shop.lan' }))).toMatch(
      /https:\/\//,
    );
  });

  it('lets the camera start on https and on localhost (both secure contexts)', () => {
    expect(cameraUnavailableReason(web({ origin: 'https://192.168.1.20:8443' }))).toBeNull();
    expect(cameraUnavailableReason(web({ origin: 'http://localhost:8080' }))).toBeNull();
  });

  it('says plainly when a secure browser has no camera to offer', () => {
    expect(cameraUnavailableReason(web({ canCapture: false }))).toMatch(/cannot use the camera.*type the short code/i);
  });

  it('leaves the phone apps to their own permission flow', () => {
    expect(
      cameraUnavailableReason({ platform: 'ios', secureContext: false, canCapture: false, origin: '' }),
    ).toBeNull();
    expect(
      cameraUnavailableReason({ platform: 'android', secureContext: false, canCapture: false, origin: '' }),
    ).toBeNull();
  });

  it('after a refusal, says whether tapping again can help', () => {
    expect(cameraRefusedMessage({ canAskAgain: true })).toMatch(/not allowed.*ask again/i);
    expect(cameraRefusedMessage({ canAskAgain: false })).toMatch(/blocked.*settings/i);
  });
});
