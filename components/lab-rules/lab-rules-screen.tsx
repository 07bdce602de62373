import { PlaceholderScreen } from '@/components/common/placeholder-screen';

export function LabRulesScreen() {
  return (
    <PlaceholderScreen
      testID="lab-rules-screen"
      title="Lab rules"
      icon="book-cog"
      comingWith="Setting the approval voltage, energy threshold, margin and interlock voltage arrives with the lab-rules work."
    />
  );
}
