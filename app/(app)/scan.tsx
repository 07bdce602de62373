import { ScanScreen } from '@/components/scan/scan-screen';

export default function ScanRoute() {
  return <ScanScreen />;
}
