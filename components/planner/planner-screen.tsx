import { router } from 'expo-router';
import { lazy, Suspense } from 'react';

import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { useBreakpoints } from '@/hooks/use-breakpoints';

import { isCalculatorName } from './calculators/names';

// The calculators and the physics behind them load only when someone opens the Planner, so the
// counter's everyday screens do not carry them in the first download.
const PlannerCalculators = lazy(() => import('./planner-calculators'));

interface PlannerScreenProps {
  /** The `tab` search parameter, so a calculator can be linked to and survives a reload. */
  tab?: string;
}

export function PlannerScreen({ tab }: PlannerScreenProps) {
  const { isWide } = useBreakpoints();
  const current = isCalculatorName(tab) ? tab : 'energy';
  return (
    <Screen testID="planner-screen" title="Planner" width={isWide ? 'wide' : 'regular'}>
      <Suspense fallback={<LoadingState label="Loading the calculators" testID="planner-loading" />}>
        <PlannerCalculators tab={current} onTabChange={(next) => router.setParams({ tab: next })} />
      </Suspense>
    </Screen>
  );
}
