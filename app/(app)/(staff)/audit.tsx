import { AuditScreen } from '@/components/audit/audit-screen';

export default function AuditRoute() {
  return <AuditScreen />;
}
