import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import type { CoronaFitSummary } from '@/shared/schemas/bench-runs';

import { sig } from './run-figures';

/** The corona-onset fits as numbers with their uncertainty, one line per gap and polarity. */
export function FitSummary({ fits }: { fits: CoronaFitSummary[] }) {
  return (
    <Card title="Corona onset fits" testID="bench-fits">
      <AppText variant="small" tone="muted">
        {"Townsend's I = C·V·(V − V₀), least squares of I/V against V, for each gap and polarity with at least four runs above onset."}
      </AppText>
      {fits.length === 0 ? (
        <AppText testID="bench-fits-none">No gap has four runs above onset yet.</AppText>
      ) : (
        <View style={styles.list}>
          {fits.map((f) => (
            <AppText key={`${f.gapMm}-${f.polarity}`} testID={`bench-fit-${f.gapMm}-${f.polarity}`}>
              {`${sig(f.gapMm)} mm, ${f.polarity}: V₀ = ${sig(f.onsetKv)} ± ${sig(f.onsetKvStdErr, 2)} kV, C = ${sig(f.c)} ± ${sig(f.cStdErr, 2)} mA/kV², R² = ${f.r2.toFixed(3)}, ${f.n} runs${f.peekOnsetKv === null ? '' : `; Peek's onset for the geometry: ${sig(f.peekOnsetKv)} kV`}`}
            </AppText>
          ))}
        </View>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({ list: { gap: spacing.xs } });
