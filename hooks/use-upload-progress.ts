// How far the upload under way has gone, for a progress bar: a photo taken on a phone is several
// megabytes, and on a lab's Wi-Fi it can take a while.
import { useCallback, useState } from 'react';

export function useUploadProgress() {
  // null when no upload is under way.
  const [fraction, setFraction] = useState<number | null>(null);
  /** Wraps an upload: progress from 0 while it runs, gone when it ends either way. */
  const track = useCallback(<T>(upload: (onProgress: (fraction: number) => void) => Promise<T>): Promise<T> => {
    setFraction(0);
    return upload(setFraction).finally(() => setFraction(null));
  }, []);
  return { fraction, track };
}
