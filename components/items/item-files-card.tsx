import { useState } from 'react';
import { Image, Pressable, StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { borders, iconSizes, layout, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { describeError, ErrorState } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { ProgressBar } from '@/components/ui/progress-bar';
import { Icon } from '@/components/ui/icon';
import { LoadingState } from '@/components/ui/loading-state';
import { webLinkProps } from '@/components/ui/web-link';
import { useItemFilesQuery, useUploadItemFileMutation } from '@/hooks/use-item-files';
import { itemUrls } from '@/hooks/use-items';
import type { Item, ItemFile } from '@/shared/schemas/items';

import { canPickFiles, pickFile } from './pick-file';

// What the server accepts (it checks the bytes, server/services/files.ts); the chooser offers the same.
const PHOTO_TYPES = 'image/jpeg,image/png,image/webp';
const DOCUMENT_TYPES = 'application/pdf';

function formatSize(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${Math.round(bytes / 1024)} KB`;
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

/** A real link on the web, opening the file in a new tab (the PDF viewer, the full-size photo). */
function FileRow({ file, divided }: { file: ItemFile; divided: boolean }) {
  const { colors } = useTheme();
  const kind = file.kind === 'photo' ? 'Photo' : 'Document';
  const detail = `${kind} · ${formatSize(file.sizeBytes)} · ${formatDateTime(file.uploadedAt)}${file.uploadedByName ? ` · ${file.uploadedByName}` : ''}`;
  return (
    <Pressable
      accessibilityRole="link"
      accessibilityLabel={`${file.fileName}, ${detail}, opens in a new tab`}
      testID={`item-file-${file.id}`}
      {...webLinkProps(itemUrls.file(file.id), { newTab: true })}
      style={[styles.file, divided && { borderTopWidth: borders.hairline, borderTopColor: colors.border }]}
    >
      <Icon name={file.kind === 'photo' ? 'image' : 'file-document'} color={colors.textMuted} />
      <View style={styles.fileText}>
        <AppText variant="bodyStrong">{file.fileName}</AppText>
        <AppText variant="small" tone="muted">
          {detail}
        </AppText>
      </View>
      <Icon name="open-in-new" size={iconSizes.sm} color={colors.primary} />
    </Pressable>
  );
}

/** The item's current photo (the latest one uploaded as a photo). */
export function ItemPhoto({ item }: { item: Item }) {
  if (item.photoFileId === null) return null;
  return (
    <Card testID="item-photo">
      <Image
        source={{ uri: itemUrls.file(item.photoFileId) }}
        style={styles.photo}
        resizeMode="contain"
        accessibilityLabel={`Photo of ${item.tag}, ${item.name}`}
      />
    </Card>
  );
}

interface ItemFilesCardProps {
  item: Item;
  canUpload: boolean;
}

export function ItemFilesCard({ item, canUpload }: ItemFilesCardProps) {
  const files = useItemFilesQuery(item.id);
  const upload = useUploadItemFileMutation(item.id);
  const [added, setAdded] = useState<string | null>(null);
  const uploadable = canUpload && canPickFiles && item.status !== 'retired';

  const choose = async (kind: ItemFile['kind']) => {
    const file = await pickFile(kind === 'photo' ? PHOTO_TYPES : DOCUMENT_TYPES);
    if (!file) return;
    setAdded(null);
    upload.mutate({ file, kind }, { onSuccess: ({ file: stored }) => setAdded(`Added ${stored.fileName}.`) });
  };

  return (
    <Card title="Photos and documents" testID="item-files">
      {files.isPending ? (
        <LoadingState label="Loading files" />
      ) : files.isError ? (
        <ErrorState title="The files did not load" error={files.error} onRetry={() => void files.refetch()} retrying={files.isRefetching} />
      ) : files.data.length === 0 ? (
        <AppText tone="muted" testID="item-files-empty">
          No photos, certificates or manuals yet.
        </AppText>
      ) : (
        <View>
          {files.data.map((file, index) => (
            <FileRow key={file.id} file={file} divided={index > 0} />
          ))}
        </View>
      )}
      {upload.isPending ? (
        <ProgressBar label={`Uploading ${upload.variables?.file.name ?? 'the file'}`} fraction={upload.progress ?? 0} testID="item-upload-progress" />
      ) : null}
      {upload.isError ? <FormAlert message={describeError(upload.error)} testID="item-upload-error" /> : null}
      {added ? (
        <AppText variant="smallStrong" accessibilityLiveRegion="polite" testID="item-upload-done">
          {added}
        </AppText>
      ) : null}
      {uploadable ? (
        <View style={styles.actions}>
          <Button
            label="Add photo"
            icon="image"
            variant="secondary"
            onPress={() => void choose('photo')}
            loading={upload.isPending && upload.variables?.kind === 'photo'}
            loadingLabel="Uploading the photo"
            disabled={upload.isPending}
            testID="item-add-photo"
          />
          <Button
            label="Add document (PDF)"
            icon="upload"
            variant="secondary"
            onPress={() => void choose('document')}
            loading={upload.isPending && upload.variables?.kind === 'document'}
            loadingLabel="Uploading the document"
            disabled={upload.isPending}
            testID="item-add-document"
          />
        </View>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  photo: { width: '100%', aspectRatio: 4 / 3, borderRadius: radii.md },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  file: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, minHeight: layout.listRowMinHeight, paddingVertical: spacing.xs },
  fileText: { flex: 1, gap: spacing.xxs },
});
