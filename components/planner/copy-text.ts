// Puts text on the clipboard. The app has no clipboard package, so: the async Clipboard API on the
// web, the older selection-and-copy route where that API is missing (plain http on a lab LAN is
// not a secure context), and the share sheet on a phone.
import { Platform, Share } from 'react-native';

export async function copyText(text: string): Promise<boolean> {
  if (Platform.OS !== 'web') {
    const result = await Share.share({ message: text });
    return result.action === Share.sharedAction;
  }
  if (typeof navigator !== 'undefined' && navigator.clipboard?.writeText) {
    try {
      await navigator.clipboard.writeText(text);
      return true;
    } catch {
      // Permission refused or the page lost focus: try the older route below.
    }
  }
  return copyWithSelection(text);
}

function copyWithSelection(text: string): boolean {
  if (typeof document === 'undefined') return false;
  const area = document.createElement('textarea');
  area.value = text;
  area.setAttribute('readonly', '');
  area.style.position = 'fixed';
  area.style.opacity = '0';
  document.body.appendChild(area);
  area.select();
  try {
    return document.execCommand('copy');
  } catch {
    return false;
  } finally {
    document.body.removeChild(area);
  }
}
