import { Linking, Platform } from 'react-native';

interface WebLinkOptions {
  /** Save the response as a file with this name instead of showing it (CSV reports). */
  download?: string;
  /** Open in a new tab, leaving Voltcrib where it was (links inside an e-mail). */
  newTab?: boolean;
}

/**
 * Props that make a Pressable a real anchor on the web (react-native-web renders `href` as <a>),
 * so the browser's own link behaviour works: new tab, copy address, downloads with the session
 * cookie. Elsewhere the press opens the address with the system.
 */
export function webLinkProps(url: string, { download, newTab = false }: WebLinkOptions = {}): object {
  if (Platform.OS !== 'web') return { onPress: () => void Linking.openURL(url) };
  const hrefAttrs: Record<string, string> = {};
  if (download !== undefined) hrefAttrs.download = download;
  if (newTab) {
    hrefAttrs.target = '_blank';
    hrefAttrs.rel = 'noopener noreferrer';
  }
  return { href: url, hrefAttrs };
}
