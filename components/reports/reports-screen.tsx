import { lazy, Suspense, useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { useBreakpoints } from '@/hooks/use-breakpoints';

import { InspectionsSection } from './inspections-section';
import { OverdueSection } from './overdue-section';
import { DEFAULT_PRESET, lastDays } from './period';
import { UsageSection } from './usage-section';

// The charts bring react-native-svg and d3: a chunk of their own, after the tables.
const ReportCharts = lazy(() => import('./report-charts').then((m) => ({ default: m.ReportCharts })));

/** The lab manager's reading: how the gear was used, what is overdue, what needs inspecting. */
export function ReportsScreen() {
  const { isWide } = useBreakpoints();
  const [period, setPeriod] = useState(() => lastDays(Number(DEFAULT_PRESET)));

  const overdueAndInspections = (
    <>
      <OverdueSection />
      <InspectionsSection />
    </>
  );

  return (
    <Screen testID="reports-screen" title="Reports" width={isWide ? 'wide' : 'regular'}>
      <AppText tone="muted">
        Use per research group, bookings overdue now, inspections coming due, charts of use, returns and incidents, and the monthly safety summary. Each
        downloads as CSV.
      </AppText>
      {isWide ? (
        <View style={styles.columns}>
          <View style={styles.column}>
            <UsageSection period={period} onPeriodChange={setPeriod} />
          </View>
          <View style={styles.column}>{overdueAndInspections}</View>
        </View>
      ) : (
        <>
          {overdueAndInspections}
          <UsageSection period={period} onPeriodChange={setPeriod} />
        </>
      )}
      <Suspense fallback={<LoadingState label="Loading the charts" />}>
        <ReportCharts period={period} />
      </Suspense>
    </Screen>
  );
}

const styles = StyleSheet.create({
  columns: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.lg },
  column: { flex: 1, minWidth: 0, gap: spacing.lg },
});
