import { TAG_PATTERN } from '@/shared/schemas/items';

// A label's QR code holds the item's URL on the lab's server, `<base>/i/<TAG>` (see
// server/services/labels.ts); older or hand-made labels may hold the bare tag. Either way the tag
// is the last path segment, compared in capitals as the server does.
const LABEL_PATH = /\/i\/([^/?#]+)\/?(?:[?#].*)?$/;

/** The asset tag in a scanned or typed text, or null when the text holds no valid tag. */
export function extractTag(text: string): string | null {
  const trimmed = text.trim();
  if (trimmed === '') return null;
  const fromUrl = LABEL_PATH.exec(trimmed);
  let candidate = trimmed;
  if (fromUrl?.[1] !== undefined) {
    try {
      candidate = decodeURIComponent(fromUrl[1]);
    } catch {
      return null;
    }
  }
  const tag = candidate.trim().toUpperCase();
  return TAG_PATTERN.test(tag) ? tag : null;
}
