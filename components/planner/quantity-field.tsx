import { StyleSheet, View } from 'react-native';

import { spacing, typeScale } from '@/components/theme/tokens';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { TextField } from '@/components/ui/text-field';

import type { FieldInput, FieldSpec } from './calculators/types';
import { findUnit } from './calculators/units';

interface QuantityFieldProps {
  spec: FieldSpec;
  input: FieldInput;
  error?: string;
  onChange: (input: FieldInput) => void;
}

/** A number in an everyday unit; where the quantity has several usual units, a choice beside it. */
export function QuantityField({ spec, input, error, onChange }: QuantityFieldProps) {
  const single = spec.units.length === 1;
  const unit = findUnit(spec.units, input.unit);
  const label = single && unit.symbol ? `${spec.label} (${unit.symbol})` : spec.label;
  return (
    <View style={styles.row}>
      <View style={styles.field}>
        <TextField
          label={label}
          testID={`planner-field-${spec.key}`}
          value={input.text}
          onChangeText={(text) => onChange({ ...input, text })}
          error={error}
          hint={spec.hint}
          inputMode={spec.signed ? 'text' : 'decimal'}
          keyboardType={spec.signed ? 'numbers-and-punctuation' : 'decimal-pad'}
          autoCorrect={false}
          autoCapitalize="none"
        />
      </View>
      {single ? null : (
        <View style={styles.units}>
          <SegmentedControl
            label={`${spec.label} unit`}
            hideLabel
            value={unit.id}
            onChange={(id) => onChange({ ...input, unit: id })}
            options={spec.units.map((u) => ({ value: u.id, label: u.symbol, testID: `planner-field-${spec.key}-unit-${u.id}` }))}
          />
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.xs },
  field: { flex: 1, minWidth: 0 },
  // Lines the unit pills up with the input box, below the field's label.
  units: { paddingTop: typeScale.label.lineHeight + spacing.xs, flexShrink: 0 },
});
