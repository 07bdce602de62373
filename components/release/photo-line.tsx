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
import type { ChecklistEntry } from '@/shared/schemas/bookings';

// "image/*" lets a phone offer its camera and gallery; the server still accepts only JPEG, PNG
// and WebP (by their bytes) and says so if another kind of image is chosen.
const PHOTO_ACCEPT = 'image/*';

interface PhotoLineProps {
  bookingId: number;
  entry: ChecklistEntry;
  fileId: number | undefined;
  onChange: (fileId: number) => void;
  error: string | undefined;
  testID: string;
}

/**
 * A checklist line answered with a photo: taken with the phone's camera (or chosen) and uploaded
 * at once, so the checklist answer only names the stored photo's id.
 */
export function PhotoLine({ bookingId, entry, fileId, onChange, error, testID }: PhotoLineProps) {
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

  return (
    <View style={styles.line} testID={testID}>
      <AppText variant="bodyStrong">{entry.text}</AppText>
      <AppText variant="small" tone="muted">
        {entry.required ? 'Required: take a photo with the phone, or choose one.' : 'Optional photo.'}
      </AppText>
      {fileId !== undefined ? (
        <View style={[styles.attached, { borderColor: colors.border }]} testID={`${testID}-attached`}>
          <Image source={{ uri: bookingPhotoUrl(fileId) }} style={[styles.thumbnail, { backgroundColor: colors.surfaceMuted }]} resizeMode="cover" accessibilityLabel={`Attached photo: ${entry.text}`} />
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
        <View style={styles.uploading} testID={`${testID}-uploading`}>
          <ProgressBar label={`Uploading ${upload.variables?.name ?? 'the photo'}`} fraction={upload.progress ?? 0} testID={`${testID}-progress`} />
          <AppText variant="small" tone="muted" accessibilityLiveRegion="polite">
            Keep this page open until it is attached.
          </AppText>
        </View>
      ) : null}
      {upload.isError ? <FormAlert message={`The photo was not attached. ${describeError(upload.error)}`} testID={`${testID}-upload-error`} /> : null}
      {canPickFiles ? (
        <Button
          label={fileId === undefined ? 'Take or choose a photo' : 'Replace the photo'}
          icon="camera"
          variant="secondary"
          onPress={() => void choose()}
          loading={upload.isPending}
          loadingLabel="Uploading the photo"
          testID={`${testID}-photo`}
        />
      ) : (
        <AppText variant="small" tone="muted">
          Photos are attached from the web app on a phone.
        </AppText>
      )}
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
  attached: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, padding: spacing.xs, borderWidth: borders.hairline, borderRadius: radii.md },
  thumbnail: { width: layout.markSizeLarge, height: layout.markSizeLarge, borderRadius: radii.sm },
  attachedText: { flex: 1, gap: spacing.xxs },
  uploading: { gap: spacing.xxs },
});
