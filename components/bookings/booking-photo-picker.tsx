import { useState } from 'react';
import { Image, StyleSheet, View } from 'react-native';

import { canPickFiles, pickFile } from '@/components/items/pick-file';
import { borders, layout, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { describeError } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { ProgressBar } from '@/components/ui/progress-bar';
import { bookingPhotoUrl, useUploadBookingPhotoMutation } from '@/hooks/use-booking-photos';

// "image/*" lets a phone offer its camera and gallery; the server still accepts only JPEG, PNG
// and WebP (by their bytes) and says so if another kind of image is chosen.
const PHOTO_ACCEPT = 'image/*';

interface BookingPhotoPickerProps {
  bookingId: number;
  /** The stored photo the answer names now, if any. */
  fileId: number | undefined;
  onChange: (fileId: number) => void;
  /** What the photo shows, for its accessible name ("Attached photo: …"). */
  subject: string;
  testID: string;
}

/**
 * A photo of a booking (a checklist line's evidence, a bench run's setup): taken with the phone's
 * camera or chosen, and uploaded at once through `POST /api/bookings/:id/photos`, so the form that
 * holds it only names the stored photo's id.
 */
export function BookingPhotoPicker({ bookingId, fileId, onChange, subject, testID }: BookingPhotoPickerProps) {
  const { colors } = useTheme();
  const upload = useUploadBookingPhotoMutation(bookingId);
  const [fileName, setFileName] = useState<string | null>(null);

  const choose = async () => {
    const file = await pickFile(PHOTO_ACCEPT, { capture: 'environment' });
    if (!file) return;
    upload.mutate(file, {
      onSuccess: ({ file: stored }) => {
        setFileName(stored.fileName);
        onChange(stored.id);
      },
    });
  };

  if (!canPickFiles) {
    return (
      <AppText variant="small" tone="muted">
        Photos are attached from the web app on a phone.
      </AppText>
    );
  }
  return (
    <View style={styles.picker}>
      {fileId !== undefined ? (
        <View style={[styles.attached, { borderColor: colors.border }]} testID={`${testID}-attached`}>
          <Image
            source={{ uri: bookingPhotoUrl(fileId) }}
            style={[styles.thumbnail, { backgroundColor: colors.surfaceMuted }]}
            resizeMode="cover"
            accessibilityLabel={`Attached photo: ${subject}`}
          />
          <View style={styles.attachedText}>
            <AppText variant="smallStrong">Photo attached</AppText>
            {fileName ? (
              <AppText variant="small" tone="muted" numberOfLines={1} testID={`${testID}-file-name`}>
                {fileName}
              </AppText>
            ) : null}
          </View>
        </View>
      ) : null}
      {upload.isPending ? (
        <View style={styles.picker} testID={`${testID}-uploading`}>
          <ProgressBar label={`Uploading ${upload.variables?.name ?? 'the photo'}`} fraction={upload.progress ?? 0} testID={`${testID}-progress`} />
          <AppText variant="small" tone="muted" accessibilityLiveRegion="polite">
            Keep this page open until it is attached.
          </AppText>
        </View>
      ) : null}
      {upload.isError ? <FormAlert message={`The photo was not attached. ${describeError(upload.error)}`} testID={`${testID}-upload-error`} /> : null}
      <Button
        label={fileId === undefined ? 'Take or choose a photo' : 'Replace the photo'}
        icon="camera"
        variant="secondary"
        onPress={() => void choose()}
        loading={upload.isPending}
        loadingLabel="Uploading the photo"
        testID={`${testID}-photo`}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  picker: { gap: spacing.xs },
  attached: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, padding: spacing.xs, borderWidth: borders.hairline, borderRadius: radii.md },
  thumbnail: { width: layout.markSizeLarge, height: layout.markSizeLarge, borderRadius: radii.sm },
  attachedText: { flex: 1, gap: spacing.xxs },
});
