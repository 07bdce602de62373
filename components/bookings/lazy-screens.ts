// The safety gate's screens load on first use: the live assessment pulls in the HV physics and
// its standards tables, which the first screen a member sees does not need.
import { lazyScreen } from '@/components/common/lazy-screen';

export const LazyBookScreen = lazyScreen(() => import('./book-screen').then((m) => m.BookScreen), { title: 'Book gear', label: 'Loading the booking form' });
export const LazyEditBookingScreen = lazyScreen(() => import('./book-screen').then((m) => m.EditBookingScreen), {
  title: 'Change booking',
  label: 'Loading the booking',
});
export const LazyBookingScreen = lazyScreen(() => import('./booking-screen').then((m) => m.BookingScreen), { title: 'Booking', label: 'Loading the booking' });
export const LazyReleaseScreen = lazyScreen(() => import('@/components/release/release-screen').then((m) => m.ReleaseScreen), {
  title: 'Release',
  label: 'Loading the release steps',
});
export const LazyReturnScreen = lazyScreen(() => import('@/components/returns/return-screen').then((m) => m.ReturnScreen), {
  title: 'Return',
  label: 'Loading the make-safe steps',
});
export const LazyApprovalsScreen = lazyScreen(() => import('@/components/approvals/approvals-screen').then((m) => m.ApprovalsScreen), {
  title: 'Approvals',
  label: 'Loading the approval queue',
});
export const LazyLabRulesScreen = lazyScreen(() => import('@/components/lab-rules/lab-rules-screen').then((m) => m.LabRulesScreen), {
  title: 'Lab rules',
  label: 'Loading the lab rules',
});
export const LazyAuditScreen = lazyScreen(() => import('@/components/audit/audit-screen').then((m) => m.AuditScreen), {
  title: 'Audit trail',
  label: 'Loading the audit trail',
});
export const LazyQualificationsScreen = lazyScreen(() => import('@/components/qualifications/qualifications-screen').then((m) => m.QualificationsScreen), {
  title: 'Qualifications',
  label: 'Loading qualifications',
});
