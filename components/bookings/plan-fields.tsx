import { Controller, type Control, type FieldErrors } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { FormNumberField } from '@/components/ui/form-fields';
import { POLARITIES, type Polarity } from '@/shared/schemas/items';

import type { BookFormValues } from './book-form-values';

const polarityWords: Record<Polarity, string> = { positive: 'Positive', negative: 'Negative', reversible: 'Reversible' };

interface PlanFieldsProps {
  control: Control<BookFormValues>;
  errors: FieldErrors<BookFormValues>;
}

/** The test plan: what the assessment and the release rules are computed from. */
export function PlanFields({ control, errors }: PlanFieldsProps) {
  return (
    <View style={styles.root}>
      <FormNumberField
        control={control}
        name="plan.plannedKv"
        label="Planned maximum voltage"
        unit="kV"
        hint="The highest voltage you will set, not the usual one."
        testID="book-planned-kv"
      />
      <Controller
        control={control}
        name="plan.polarity"
        render={({ field }) => (
          <ChoiceChips
            label="Polarity"
            testID="book-polarity"
            choices={POLARITIES.map((p) => ({ value: p, label: polarityWords[p] }))}
            value={field.value}
            onChange={field.onChange}
            error={errors.plan?.polarity ? 'Pick the polarity' : undefined}
          />
        )}
      />
      <FormNumberField
        control={control}
        name="plan.maxCurrentMa"
        label="Maximum current"
        unit="mA"
        hint="The load current you expect; the multiplier output is computed at it."
        testID="book-max-current"
      />
      <FormNumberField control={control} name="plan.peoplePresent" label="People present, you included" unit="people" integer testID="book-people" />
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.md },
});
