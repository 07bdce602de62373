import { StyleSheet, View } from 'react-native';

import { BookingPhotoPicker } from '@/components/bookings/booking-photo-picker';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import type { ChecklistEntry } from '@/shared/schemas/bookings';

interface PhotoLineProps {
  bookingId: number;
  entry: ChecklistEntry;
  fileId: number | undefined;
  onChange: (fileId: number) => void;
  error: string | undefined;
  testID: string;
}

/** A checklist line answered with a photo: the answer only names the stored photo's id. */
export function PhotoLine({ bookingId, entry, fileId, onChange, error, testID }: PhotoLineProps) {
  return (
    <View style={styles.line} testID={testID}>
      <AppText variant="bodyStrong">{entry.text}</AppText>
      <AppText variant="small" tone="muted">
        {entry.required ? 'Required: take a photo with the phone, or choose one.' : 'Optional photo.'}
      </AppText>
      <BookingPhotoPicker bookingId={bookingId} fileId={fileId} onChange={onChange} subject={entry.text} testID={testID} />
      {error ? (
        <AppText variant="smallStrong" tone="error">
          {error}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  line: { gap: spacing.xs },
});
