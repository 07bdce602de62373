// The camera half of QrScanner, loaded on demand (React.lazy in qr-scanner.tsx) so expo-camera
// and the QR decoder stay out of the main bundle. Default export for React.lazy.
import { CameraView, useCameraPermissions, type BarcodeScanningResult } from 'expo-camera';
import { useCallback, useEffect, useRef, useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { borders, layout, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { LoadingState } from '@/components/ui/loading-state';

import { CameraNotice } from './camera-notice';
import { prepareDecoder } from './prepare-decoder';

export interface QrCameraProps {
  /** Every decoded text; the scanner extracts and de-duplicates tags. */
  onText: (text: string) => void;
  /** Stops decoding (the preview keeps running so resuming is instant). */
  paused: boolean;
  testID: string;
}

type DecoderState = 'loading' | 'ready' | 'failed';
type Availability = 'checking' | 'available' | 'unavailable';

export default function QrCamera({ onText, paused, testID }: QrCameraProps) {
  const [permission, requestPermission] = useCameraPermissions();
  const [decoder, setDecoder] = useState<DecoderState>('loading');
  const [availability, setAvailability] = useState<Availability>('checking');
  const [mountError, setMountError] = useState<string | null>(null);
  const [asking, setAsking] = useState(false);

  useEffect(() => {
    let live = true;
    // The decoder must be pointed at our own wasm before CameraView first asks for it.
    prepareDecoder().then(
      () => live && setDecoder('ready'),
      () => live && setDecoder('failed'),
    );
    CameraView.isAvailableAsync().then(
      (available) => live && setAvailability(available ? 'available' : 'unavailable'),
      () => live && setAvailability('unavailable'),
    );
    return () => {
      live = false;
    };
  }, []);

  // expo-camera's web scanner loop keeps the first callback it was given, so hand it one stable
  // function that always reaches the latest `onText`.
  const onTextRef = useRef(onText);
  useEffect(() => {
    onTextRef.current = onText;
  }, [onText]);
  const handleScanned = useCallback((result: BarcodeScanningResult) => onTextRef.current(result.data), []);

  const ask = async () => {
    setAsking(true);
    setMountError(null);
    try {
      await requestPermission();
    } finally {
      setAsking(false);
    }
  };

  if (availability === 'unavailable') {
    return (
      <CameraNotice
        testID={`${testID}-unavailable`}
        icon="camera-off"
        title="No camera here"
        message="This device or browser offers Voltcrib no camera (browsers only allow it on a secure https address). Type the tag printed under the QR code instead."
      />
    );
  }
  if (decoder === 'failed') {
    return (
      <CameraNotice
        testID={`${testID}-decoder-failed`}
        icon="camera-off"
        title="The QR reader did not load"
        message="Reload the page to try again, or type the tag printed under the QR code."
      />
    );
  }
  if (permission === null || availability === 'checking') {
    return <LoadingState label="Starting the camera" testID={`${testID}-starting`} />;
  }
  if (!permission.granted) {
    const blocked = permission.status === 'denied';
    return (
      <CameraNotice
        testID={blocked ? `${testID}-permission-denied` : `${testID}-permission-needed`}
        icon={blocked ? 'camera-off' : 'camera'}
        title={blocked ? 'Camera blocked' : 'Scan with the camera'}
        message={
          blocked
            ? 'Voltcrib may not use the camera. To allow it, open this site’s settings in your browser (the icon beside the address), set Camera to Allow, then try again. Until then, type the tag below.'
            : 'Voltcrib reads gear labels with your camera. Nothing is recorded or sent: the picture is read on this device.'
        }
        action={
          <Button
            label={blocked ? 'Try the camera again' : 'Turn on camera'}
            icon="camera"
            variant={blocked ? 'secondary' : 'primary'}
            onPress={() => void ask()}
            loading={asking}
            loadingLabel="Asking for the camera"
            testID={`${testID}-enable`}
          />
        }
      />
    );
  }
  if (mountError !== null) {
    return (
      <CameraNotice
        testID={`${testID}-failed`}
        icon="camera-off"
        title="The camera did not start"
        message={`${mountError} Close other apps that use the camera and try again, or type the tag below.`}
        action={<Button label="Try again" icon="refresh" variant="secondary" onPress={() => void ask()} loading={asking} testID={`${testID}-retry`} />}
      />
    );
  }
  if (decoder === 'loading') {
    return <LoadingState label="Loading the QR reader" testID={`${testID}-starting`} />;
  }
  return <Viewfinder testID={testID} paused={paused} onScanned={handleScanned} onMountError={(message) => setMountError(message)} />;
}

interface ViewfinderProps {
  testID: string;
  paused: boolean;
  onScanned: (result: BarcodeScanningResult) => void;
  onMountError: (message: string) => void;
}

function Viewfinder({ testID, paused, onScanned, onMountError }: ViewfinderProps) {
  const { colors } = useTheme();
  return (
    <View style={styles.wrapper}>
      <View
        testID={testID}
        accessible
        // A named image: aria-label is not allowed on a plain div (axe aria-prohibited-attr).
        role="img"
        accessibilityLabel={paused ? 'Camera preview, paused' : 'Camera preview, reading QR codes'}
        style={[styles.frame, { borderColor: paused ? colors.border : colors.primary, backgroundColor: colors.surfaceMuted }]}
      >
        <CameraView
          style={StyleSheet.absoluteFill}
          facing="back"
          barcodeScannerSettings={{ barcodeTypes: ['qr'] }}
          // Undefined while paused: expo-camera then stops decoding frames altogether.
          onBarcodeScanned={paused ? undefined : onScanned}
          onMountError={(event) => onMountError(event.message || 'The camera could not be opened.')}
        />
      </View>
      <AppText variant="small" tone="muted" style={styles.hint}>
        {paused ? 'Paused.' : 'Hold the QR label flat inside the frame, about a hand’s width away.'}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  wrapper: { gap: spacing.xs, alignItems: 'center', alignSelf: 'stretch' },
  frame: {
    width: '100%',
    maxWidth: layout.formMaxWidth,
    // Landscape, like the camera's own frame, so the typed field below stays on a phone's screen.
    aspectRatio: 4 / 3,
    borderWidth: borders.focusRing,
    borderRadius: radii.lg,
    overflow: 'hidden',
  },
  hint: { textAlign: 'center' },
});
