import { StyleSheet, View } from 'react-native';

import { layout, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';

interface VoltcribMarkProps {
  size?: number;
}

// Voltcrib's mark, drawn from plain Views so it needs no image or SVG: a V (for volts) whose two
// strokes stop short of meeting — a spark gap, the distance that keeps people safe — held in a
// square crib (the shared cage of gear). Proportions are fractions of the square so it scales.
const STROKE_WIDTH = 0.15;
const STROKE_TOP = 0.2;
const STROKE_BOTTOM = 0.76;
/** Half the distance between the strokes' tops, and half the gap left at the bottom. */
const TOP_HALF_SPREAD = 0.27;
const GAP_HALF = 0.06;

export function VoltcribMark({ size = layout.markSize }: VoltcribMarkProps) {
  const { colors } = useTheme();
  const rise = (STROKE_BOTTOM - STROKE_TOP) * size;
  const run = (TOP_HALF_SPREAD - GAP_HALF) * size;
  const length = Math.hypot(rise, run);
  const angle = (Math.atan2(run, rise) * 180) / Math.PI;
  const width = size * STROKE_WIDTH;
  const centreY = ((STROKE_TOP + STROKE_BOTTOM) / 2) * size;
  const centreOffsetX = ((TOP_HALF_SPREAD + GAP_HALF) / 2) * size;

  return (
    <View
      accessibilityRole="image"
      accessibilityLabel="Voltcrib"
      style={[styles.crib, { width: size, height: size, borderRadius: size * (radii.md / layout.markSize), backgroundColor: colors.primary }]}
    >
      {[-1, 1].map((side) => (
        <View
          key={side}
          style={[
            styles.stroke,
            {
              width,
              height: length,
              borderRadius: width / 2,
              left: size / 2 + side * centreOffsetX - width / 2,
              top: centreY - length / 2,
              backgroundColor: colors.onPrimary,
              transform: [{ rotate: `${side * angle}deg` }],
            },
          ]}
        />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  crib: { overflow: 'hidden' },
  stroke: { position: 'absolute' },
});

interface VoltcribLockupProps {
  size?: number;
}

/** The mark with the name beside it, for the sign-in screen and the side navigation. */
export function VoltcribLockup({ size = layout.markSize }: VoltcribLockupProps) {
  return (
    <View style={lockupStyles.row}>
      <VoltcribMark size={size} />
      <AppText variant={size >= layout.markSizeLarge ? 'display' : 'heading'} accessibilityElementsHidden importantForAccessibility="no">
        Voltcrib
      </AppText>
    </View>
  );
}

const lockupStyles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
});
