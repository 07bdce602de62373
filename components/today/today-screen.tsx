import { router } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { roleLabels } from '@/components/common/roles';
import { spacing, type HazardLevel } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { Screen } from '@/components/ui/screen';
import { useBreakpoints } from '@/hooks/use-breakpoints';
import { useCurrentUser } from '@/hooks/use-session';

import { TodayIncidents } from '@/components/incidents/today-incidents';

import { DeskOverview } from './desk-overview';
import { ApprovalsWaiting, MyGearOut, MyNextBookings } from './today-lists';

// What each level means in Voltcrib, in the words of the safety-colour convention it follows.
const hazardLegend: { level: HazardLevel; meaning: string }[] = [
  { level: 'danger', meaning: 'Will kill or seriously injure if ignored.' },
  { level: 'warning', meaning: 'Could kill or seriously injure if ignored.' },
  { level: 'caution', meaning: 'Could cause minor injury or damage gear.' },
  { level: 'safe', meaning: 'Made safe: de-energised, grounded, checked.' },
  { level: 'info', meaning: 'Something to know; no hazard by itself.' },
];

/** The day at a glance: for staff the lab's desk first, then my gear out (overdue first), the queue and my next bookings. */
export function TodayScreen() {
  const user = useCurrentUser();
  const { isWide } = useBreakpoints();
  const [legendOpen, setLegendOpen] = useState(false);
  return (
    <Screen testID="today-screen" title="Today" hideTitle>
      <View style={styles.greeting}>
        <AppText variant="display" headingLevel={1} testID="today-greeting">
          {user ? `Hello, ${user.name}` : 'Hello'}
        </AppText>
        {user ? <Badge label={roleLabels[user.role]} tone="primary" icon="badge-account" testID="today-role" /> : null}
      </View>
      <Button label="Scan a label" icon="qrcode-scan" block={!isWide} testID="today-scan" onPress={() => router.navigate('/scan')} />
      {user ? (
        <>
          <DeskOverview role={user.role} />
          <TodayIncidents role={user.role} />
          {user.role === 'officer' ? <ApprovalsWaiting officerId={user.id} /> : null}
          <MyGearOut />
          <MyNextBookings />
        </>
      ) : null}
      {/* The legend is for when a mark is not clear: one press away, not a permanent card. */}
      <Button
        label={legendOpen ? 'Hide what the hazard marks mean' : 'What the hazard marks mean'}
        icon="information"
        variant="secondary"
        testID="today-legend-toggle"
        onPress={() => setLegendOpen(!legendOpen)}
      />
      {legendOpen ? (
        <Card title="How Voltcrib marks hazards" testID="today-legend">
          <View style={styles.legend}>
            {hazardLegend.map(({ level, meaning }) => (
              <View key={level} style={styles.legendRow}>
                <HazardBadge level={level} />
                <AppText variant="small" tone="muted">
                  {meaning}
                </AppText>
              </View>
            ))}
          </View>
        </Card>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  greeting: { gap: spacing.sm },
  legend: { gap: spacing.md },
  legendRow: { gap: spacing.xxs },
});
