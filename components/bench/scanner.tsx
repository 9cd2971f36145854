import { CameraView, useCameraPermissions, type BarcodeScanningResult } from 'expo-camera';
import { useIsFocused } from 'expo-router';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { Platform, StyleSheet, View } from 'react-native';
import { colors, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { cameraRefusedMessage, cameraUnavailableReason, currentCameraSetting } from './camera-access';
import { setUpScanner } from './scanner-setup';

type Props = {
  /** Called with the text of each new code; the scanner waits until the promise settles. */
  onCode: (text: string) => Promise<void>;
};

/** Camera viewfinder that reads QR labels. It runs only while the bench is on screen. */
export function Scanner({ onCode }: Props) {
  const focused = useIsFocused();
  const [permission, requestPermission] = useCameraPermissions();
  const [open, setOpen] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const busy = useRef(false);
  const last = useRef<{ text: string; at: number } | null>(null);
  // Read once: a page's address (http or https) does not change while it is open.
  const unavailable = useMemo(() => cameraUnavailableReason(currentCameraSetting()), []);

  // On a phone app with the camera already allowed, open straight away; the web waits for a tap. Done
  // while rendering, when the permission turns granted, so "Stop camera" still closes it afterwards.
  const grantedOnPhone = Platform.OS !== 'web' && !!permission?.granted;
  const [wasGranted, setWasGranted] = useState(false);
  if (grantedOnPhone !== wasGranted) {
    setWasGranted(grantedOnPhone);
    if (grantedOnPhone) setOpen(true);
  }

  // The decoder's own chunk, fetched once the bench is up rather than with the app.
  useEffect(() => {
    setUpScanner().catch(() => undefined);
  }, []);

  const start = async () => {
    setProblem(null);
    // In place before the camera opens: the camera would otherwise load the decoder without our wasm path.
    const ready = setUpScanner(true).then(
      () => true,
      () => false,
    );
    const p = permission?.granted ? permission : await requestPermission();
    if (!p.granted) setProblem(cameraRefusedMessage(p));
    else if (await ready) setOpen(true);
    else setProblem('The code reader did not load. Check the connection and try again, or type the short code.');
  };

  const handle = useCallback(
    (r: BarcodeScanningResult) => {
      const text = r.data?.trim();
      if (!text || busy.current) return;
      const now = Date.now();
      if (last.current && last.current.text === text && now - last.current.at < 4000) return;
      last.current = { text, at: now };
      busy.current = true;
      void onCode(text).finally(() => {
        busy.current = false;
      });
    },
    [onCode],
  );

  if (unavailable) {
    // No button that cannot work: the reason, and the short code beside it still opens the part.
    return (
      <View style={styles.closed}>
        <Notice tone="caution" testID="scan-needs-https">
          {unavailable}
        </Notice>
      </View>
    );
  }

  // The same notice whether the camera is open or not: a failed start shows beside the button again.
  const problemNotice = problem ? (
    <Notice tone="error" testID="scan-problem">
      {problem}
    </Notice>
  ) : null;

  if (!open || !focused) {
    return (
      <View style={styles.closed}>
        <Button label="Scan a label" onPress={() => void start()} testID="start-scan" />
        <Txt variant="small" tone="soft">
          Point the camera at the QR code on the part.
        </Txt>
        {problemNotice}
      </View>
    );
  }

  return (
    <View style={{ gap: space.sm }}>
      <View style={styles.viewfinder} testID="scanner">
        <CameraView
          style={StyleSheet.absoluteFill}
          facing="back"
          barcodeScannerSettings={{ barcodeTypes: ['qr'] }}
          onBarcodeScanned={handle}
          onMountError={(e) => setProblem(`The camera did not start: ${e.message}`)}
        />
        <View pointerEvents="none" style={styles.frame} />
      </View>
      <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center' }}>
        <Txt variant="small" tone="soft" style={{ flex: 1 }}>
          Hold the label inside the frame.
        </Txt>
        <Button label="Stop camera" variant="secondary" onPress={() => setOpen(false)} testID="stop-scan" />
      </View>
      {problemNotice}
    </View>
  );
}

const styles = StyleSheet.create({
  closed: { gap: space.sm, alignItems: 'flex-start' },
  viewfinder: { height: 280, backgroundColor: colors.ink, overflow: 'hidden', borderWidth: 1, borderColor: colors.ink },
  frame: {
    position: 'absolute',
    left: '18%',
    right: '18%',
    top: '12%',
    bottom: '12%',
    borderWidth: 3,
    borderColor: colors.paperRaised,
    borderStyle: 'dashed',
  },
});
