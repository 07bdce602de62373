import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import type { Assessment } from '@/shared/schemas/assessment';

import { Fact } from './fact';
import { formatKv, formatSeconds, formatSi } from './quantities';

/** Stored energy at the planned voltage and how long the output takes to bleed down. */
export function EnergyFacts({ assessment, testID = 'assessment-energy' }: { assessment: Assessment; testID?: string }) {
  const { bleedDown } = assessment;
  return (
    <View style={styles.root} testID={testID}>
      <Fact
        testID={`${testID}-stored`}
        label="Stored energy at the planned voltage"
        value={formatSi(assessment.storedEnergyJ, 'J')}
        note={`Output capacitance ${formatSi(assessment.outputCapacitanceF, 'F')}`}
        source={`E = ½·C·V² over the sources' output capacitance at ${formatKv(assessment.plannedKv)}, plus the stored energy of any multiplier stack (E_stack = (4n − 1.5)·C·V²)`}
      />
      {bleedDown ? (
        <Fact
          testID={`${testID}-bleed`}
          label="Bleed-down time to the lab's safe voltage"
          value={formatSeconds(bleedDown.timeS)}
          note={`${assessment.bleedDownNote} ${bleedDown.note}`.trim()}
          source={`t = R·C·ln(V₀ / V_safe) with R = ${formatSi(bleedDown.resistanceOhm, 'Ω')} of bleeders; ${bleedDown.source}`}
        />
      ) : (
        <Fact testID={`${testID}-bleed`} label="Bleed-down" value="Ground it: no computed time" note={assessment.bleedDownNote} />
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.md },
});
