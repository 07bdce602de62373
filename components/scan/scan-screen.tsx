import { PlaceholderScreen } from '@/components/common/placeholder-screen';

export function ScanScreen() {
  return (
    <PlaceholderScreen
      testID="scan-screen"
      title="Scan"
      icon="qrcode-scan"
      comingWith="Scanning QR labels with the camera, or typing a tag, arrives with the scanning work."
    />
  );
}
