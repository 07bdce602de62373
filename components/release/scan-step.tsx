import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { QrScanner } from '@/components/scan/qr-scanner';
import { borders, iconSizes, layout, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { describeError } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { Icon } from '@/components/ui/icon';
import { useScanMutation, type Booking } from '@/hooks/use-bookings';

import { StepCard, type StepState } from './step-card';

/** Step 1: every booked item is scanned (or its tag typed) at the counter and ticked off. */
export function ScanStep({ booking, state }: { booking: Booking; state: StepState }) {
  const { colors } = useTheme();
  const scan = useScanMutation(booking.id);
  const [outcome, setOutcome] = useState<{ ok: boolean; text: string } | null>(null);
  const scanned = booking.items.filter((item) => booking.scannedItemIds.includes(item.id)).length;
  const all = scanned === booking.items.length;

  const onTag = (tag: string) => {
    setOutcome(null);
    // A second scan of a ticked-off item changes nothing: say so instead of "ticked off" again.
    const already = booking.items.find((item) => item.tag.toUpperCase() === tag.toUpperCase() && booking.scannedItemIds.includes(item.id));
    if (already) {
      setOutcome({ ok: true, text: `${already.tag} was already ticked off. ${booking.items.length - scanned} still to scan.` });
      return;
    }
    scan.mutate(tag, {
      onSuccess: () => setOutcome({ ok: true, text: `${tag} ticked off.` }),
      // The server says why (not in this booking, unknown tag): show its words as they are.
      onError: (error) => setOutcome({ ok: false, text: describeError(error) }),
    });
  };

  const result = outcome ? (
    outcome.ok ? (
      <View accessibilityLiveRegion="polite">
        <Badge label={outcome.text} icon="check-circle" testID="release-scan-ok" />
      </View>
    ) : (
      <FormAlert message={outcome.text} testID="release-scan-error" />
    )
  ) : null;

  return (
    <StepCard number={1} title="Scan each item" state={state} testID="release-step-scan">
      <AppText variant="bodyStrong" testID="release-scan-count">{`${scanned} of ${booking.items.length} scanned`}</AppText>
      <View style={[styles.list, { borderColor: colors.border }]}>
        {booking.items.map((item, index) => {
          const done = booking.scannedItemIds.includes(item.id);
          return (
            <View
              key={item.id}
              testID={`scan-item-${item.id}`}
              accessibilityLabel={`${item.tag}, ${done ? 'scanned' : 'not scanned yet'}`}
              style={[styles.row, index > 0 && { borderTopWidth: borders.hairline, borderTopColor: colors.border }]}
            >
              <Icon name={done ? 'checkbox-marked' : 'checkbox-blank-outline'} size={iconSizes.md} color={done ? colors.primary : colors.textMuted} />
              <View style={styles.rowText}>
                <AppText variant="bodyStrong">{item.tag}</AppText>
                <AppText variant="small" tone="muted">
                  {item.name}
                </AppText>
              </View>
              <Badge
                label={done ? 'Scanned' : 'Not yet'}
                icon={done ? 'check-circle' : 'clock-outline'}
                tone={done ? 'primary' : 'muted'}
                testID={`scan-item-${item.id}-${done ? 'scanned' : 'pending'}`}
              />
            </View>
          );
        })}
      </View>
      {all ? result : <QrScanner onTag={onTag} paused={scan.isPending} typedSubmitLabel="Tick off" result={result} testID="release-scanner" />}
    </StepCard>
  );
}

const styles = StyleSheet.create({
  list: { borderWidth: borders.hairline, borderRadius: radii.md, overflow: 'hidden' },
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    minHeight: layout.listRowMinHeight,
    paddingHorizontal: spacing.sm,
    paddingVertical: spacing.xs,
  },
  rowText: { flex: 1, gap: spacing.xxs },
});
