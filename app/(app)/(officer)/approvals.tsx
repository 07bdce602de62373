import { ApprovalsScreen } from '@/components/approvals/approvals-screen';

export default function ApprovalsRoute() {
  return <ApprovalsScreen />;
}
