import { Badge } from '@/components/ui/badge';

import type { QualificationState } from './qualification';

/** A short word for the list; the People panel spells the dates out. Word and icon, never colour alone. */
export function QualificationBadge({ state, testID }: { state: QualificationState; testID?: string }) {
  if (state.kind === 'none') return <Badge label="No HV qualification" tone="muted" testID={testID} />;
  if (state.kind === 'expired') return <Badge label="Qualification expired" icon="alert-circle" tone="neutral" testID={testID} />;
  return <Badge label={`HV ≤ ${state.authorisedKv} kV`} icon="shield-check" tone="primary" testID={testID} />;
}
