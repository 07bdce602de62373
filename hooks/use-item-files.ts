// Photos and documents of an item. Uploads go as multipart form data (apiUpload); the bytes are
// served by GET /api/files/:id, used directly as an image source or a link (itemUrls.file).
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { ItemFile } from '@/shared/schemas/items';

import { apiUpload, apiRequest } from './api-client';
import { useUploadProgress } from './use-upload-progress';
import { itemKeys } from './use-items';

export const itemFileKeys = {
  all: ['item-files'] as const,
  list: (itemId: number) => [...itemFileKeys.all, itemId] as const,
};

export function useItemFilesQuery(itemId: number) {
  return useQuery({
    queryKey: itemFileKeys.list(itemId),
    queryFn: ({ signal }) => apiRequest<{ files: ItemFile[] }>(`/api/items/${itemId}/files`, { signal }),
    select: (data) => data.files,
  });
}

export interface ItemFileUpload {
  /** A browser File (from a file input); the server checks its bytes, not its name. */
  file: Blob & { name: string };
  kind: ItemFile['kind'];
}

/** The upload, with `progress` (0 to 1, or null when none is under way). */
export function useUploadItemFileMutation(itemId: number) {
  const queryClient = useQueryClient();
  const { fraction, track } = useUploadProgress();
  const mutation = useMutation({
    mutationFn: ({ file, kind }: ItemFileUpload) => {
      const form = new FormData();
      // The kind goes first: multer reads fields in order and the server validates them with the file.
      form.append('kind', kind);
      form.append('file', file, file.name);
      return track((onProgress) => apiUpload<{ file: ItemFile }>(`/api/items/${itemId}/files`, form, onProgress));
    },
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: itemFileKeys.list(itemId) }),
        // A photo becomes the item's picture, and the upload is in its history.
        queryClient.invalidateQueries({ queryKey: itemKeys.detail(itemId) }),
      ]);
    },
  });
  return { ...mutation, progress: fraction };
}
