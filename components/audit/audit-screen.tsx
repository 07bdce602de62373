import { PlaceholderScreen } from '@/components/common/placeholder-screen';

export function AuditScreen() {
  return (
    <PlaceholderScreen
      testID="audit-screen"
      title="Audit"
      icon="history"
      comingWith="The audit trail of every change, who made it and when, arrives with the audit work."
    />
  );
}
