import { useLocalSearchParams } from 'expo-router';

import { LazyReportIncidentScreen } from '@/components/incidents/lazy-screens';

export default function ReportIncidentRoute() {
  const { itemId, bookingId } = useLocalSearchParams<{ itemId?: string; bookingId?: string }>();
  const id = (value: string | undefined) => (value && /^\d+$/.test(value) ? Number(value) : undefined);
  return <LazyReportIncidentScreen itemId={id(itemId)} bookingId={id(bookingId)} />;
}
