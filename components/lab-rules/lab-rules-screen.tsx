import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { AppText } from '@/components/ui/app-text';
import { Screen } from '@/components/ui/screen';
import { useLabRulesQuery } from '@/hooks/use-lab-rules';

import { ChecklistLines } from './checklist-lines';
import { LabRulesForm } from './lab-rules-form';

/** The safety officer's settings for the gate: approval limits, margin, interlock, safe voltage, timing. */
export function LabRulesScreen() {
  const rules = useLabRulesQuery();
  return (
    <Screen testID="lab-rules-screen" title="Lab rules" width="form">
      <AppText tone="muted">
        These numbers decide when a test needs your approval and what the release and return check. Follow local codes and the lab&apos;s licensed practice when
        changing them.
      </AppText>
      {rules.isPending ? (
        <LoadingState label="Loading the lab rules" />
      ) : rules.isError ? (
        <ErrorState title="The lab rules did not load" error={rules.error} onRetry={() => void rules.refetch()} retrying={rules.isFetching} />
      ) : (
        <LabRulesForm rules={rules.data} />
      )}
      <ChecklistLines />
    </Screen>
  );
}
