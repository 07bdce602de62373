import { PlaceholderScreen } from '@/components/common/placeholder-screen';

export function ApprovalsScreen() {
  return (
    <PlaceholderScreen
      testID="approvals-screen"
      title="Approvals"
      icon="clipboard-check"
      comingWith="The queue of tests waiting for your approval arrives with the approvals work."
    />
  );
}
