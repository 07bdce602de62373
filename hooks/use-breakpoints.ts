import { useWindowDimensions } from 'react-native';

import { breakpoints } from '@/components/theme/tokens';

export interface Breakpoints {
  /** Side navigation, tables and two-column layouts. */
  isWide: boolean;
}

/** Layout switches at the named breakpoints only; screens never compare widths themselves. */
export function useBreakpoints(): Breakpoints {
  const { width } = useWindowDimensions();
  return { isWide: width >= breakpoints.wide };
}
