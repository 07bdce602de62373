// Photos taken at the counter for a booking's checklist lines. The upload answers with the
// photo's id, which the checklist answer then names; the bytes are served by GET /api/files/:id.
import { useMutation } from '@tanstack/react-query';

import type { BookingPhoto } from '@/shared/schemas/bookings';

import { apiUpload } from './api-client';
import { useUploadProgress } from './use-upload-progress';

export const bookingPhotoUrl = (fileId: number) => `/api/files/${fileId}`;

/** A browser File (from a file input); the server checks its bytes, not its name. */
export type PhotoFile = Blob & { name: string };

/** The upload, with `progress` (0 to 1, or null when none is under way). */
export function useUploadBookingPhotoMutation(bookingId: number) {
  const { fraction, track } = useUploadProgress();
  const mutation = useMutation({
    mutationFn: (file: PhotoFile) => {
      const form = new FormData();
      form.append('file', file, file.name);
      return track((onProgress) => apiUpload<{ file: BookingPhoto }>(`/api/bookings/${bookingId}/photos`, form, onProgress));
    },
    // Nothing cached changes: the booking shows its photos only through the checklist answer
    // that names them, which the checklist mutation records (and invalidates) later.
  });
  return { ...mutation, progress: fraction };
}
