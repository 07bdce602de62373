// A reusable QR label reader: camera (loaded on demand) plus the typed-tag fallback, which is
// always shown. It reports asset tags only — label URLs are reduced to their tag — and reports the
// same tag at most once every few seconds, since the camera sees a label many times a second.
//
// testIDs, for screens and browser tests that embed it (prefix = `testID`, default `qr-scanner`):
//   <prefix>-camera (live preview) · <prefix>-camera-permission-needed / -permission-denied /
//   -unavailable / -failed / -unloaded (camera notices) · <prefix>-camera-enable (turn on / try again) ·
//   <prefix>-not-a-label (a QR code that holds no tag) · <prefix>-typed-input / -typed-submit.
import { Component, lazy, Suspense, useCallback, useEffect, useRef, useState, type JSX, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { LoadingState } from '@/components/ui/loading-state';

import { CameraNotice } from './camera-notice';
import { extractTag } from './extract-tag';
import { TypedTagForm } from './typed-tag-form';

const QrCamera = lazy(() => import('./qr-camera'));

/** How long the same tag is ignored after it was reported. */
const REPEAT_QUIET_MS = 3000;

export interface QrScannerProps {
  onTag: (tag: string) => void;
  /** Stops reporting (e.g. while the screen looks a tag up); the typed field is disabled too. */
  paused?: boolean;
  testID?: string;
  /** What the typed tag's button does where the scanner is used ("Open", "Tick off"). */
  typedSubmitLabel?: string;
  /** The answer to the last tag, shown right under the typed field, where the eyes and keyboard are. */
  result?: ReactNode;
}

export function QrScanner({ onTag, paused = false, testID = 'qr-scanner', typedSubmitLabel, result }: QrScannerProps): JSX.Element {
  const [notALabel, setNotALabel] = useState(false);
  const lastReported = useRef<{ tag: string; at: number } | null>(null);
  const onTagRef = useRef(onTag);
  useEffect(() => {
    onTagRef.current = onTag;
  }, [onTag]);

  const report = useCallback((tag: string) => {
    lastReported.current = { tag, at: Date.now() };
    setNotALabel(false);
    onTagRef.current(tag);
  }, []);

  const pausedRef = useRef(paused);
  useEffect(() => {
    pausedRef.current = paused;
  }, [paused]);

  const onText = useCallback(
    (text: string) => {
      if (pausedRef.current) return;
      const tag = extractTag(text);
      if (tag === null) {
        setNotALabel(true);
        return;
      }
      const last = lastReported.current;
      if (last && last.tag === tag && Date.now() - last.at < REPEAT_QUIET_MS) return;
      report(tag);
    },
    [report],
  );

  return (
    <View style={styles.root} testID={testID}>
      <CameraBoundary testID={`${testID}-camera-unloaded`}>
        <Suspense fallback={<LoadingState label="Loading the camera" testID={`${testID}-camera-loading`} />}>
          <QrCamera onText={onText} paused={paused} testID={`${testID}-camera`} />
        </Suspense>
      </CameraBoundary>
      {notALabel ? (
        <AppText variant="smallStrong" tone="error" accessibilityLiveRegion="polite" testID={`${testID}-not-a-label`}>
          That QR code is not a Voltcrib gear label. Scan the label on the item, or type its tag.
        </AppText>
      ) : null}
      <TypedTagForm onTag={report} disabled={paused} submitLabel={typedSubmitLabel} testID={`${testID}-typed`} />
      {result}
    </View>
  );
}

interface CameraBoundaryProps {
  testID: string;
  children: ReactNode;
}

/** A camera module that fails to load (offline, old browser) must not take the typed field with it. */
class CameraBoundary extends Component<CameraBoundaryProps, { failed: boolean }> {
  override state = { failed: false };

  static getDerivedStateFromError(): { failed: boolean } {
    return { failed: true };
  }

  override render() {
    if (!this.state.failed) return this.props.children;
    return (
      <CameraNotice
        testID={this.props.testID}
        icon="camera-off"
        title="The camera part did not load"
        message="Check the connection and reload the page. Typing the tag below works meanwhile."
      />
    );
  }
}

const styles = StyleSheet.create({
  root: { gap: spacing.md, alignSelf: 'stretch' },
});
