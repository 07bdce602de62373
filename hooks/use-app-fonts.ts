// Devices: the text fonts and the icon font are registered from the app bundle before the first
// screen draws (see use-app-fonts.web.ts for the browser).
import { AtkinsonHyperlegible_400Regular } from '@expo-google-fonts/atkinson-hyperlegible/400Regular';
import { AtkinsonHyperlegible_700Bold } from '@expo-google-fonts/atkinson-hyperlegible/700Bold';
import { useFonts } from 'expo-font';

import { iconFont } from '@/components/ui/icon';

/** [ready, error]: a missing font falls back to the system face rather than blocking the app. */
export function useAppFonts(): [boolean, Error | null] {
  return useFonts({ AtkinsonHyperlegible_400Regular, AtkinsonHyperlegible_700Bold, ...iconFont });
}
