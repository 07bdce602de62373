// The incident screens load on first use, so the first screen's bundle budget holds.
import { lazyScreen } from '@/components/common/lazy-screen';

export const LazyIncidentsScreen = lazyScreen(() => import('./incidents-screen').then((m) => m.IncidentsScreen), {
  title: 'Incidents',
  label: 'Loading incidents',
});
export const LazyIncidentScreen = lazyScreen(() => import('./incident-screen').then((m) => m.IncidentScreen), {
  title: 'Incident',
  label: 'Loading the report',
});
export const LazyReportIncidentScreen = lazyScreen(() => import('./report-incident-screen').then((m) => m.ReportIncidentScreen), {
  title: 'Report an incident',
  label: 'Loading the form',
});
