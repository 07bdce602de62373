import { useColorScheme } from 'react-native';

import { useThemePreference } from './theme-preference';
import { darkTheme, lightTheme, type Theme } from './tokens';

/** The theme the person chose, or the system colour scheme's (followed live) when they did not. */
export function useTheme(): Theme {
  const system = useColorScheme();
  const preference = useThemePreference();
  const scheme = preference === 'system' ? system : preference;
  return scheme === 'dark' ? darkTheme : lightTheme;
}
