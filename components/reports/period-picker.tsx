import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';

import { spacing } from '@/components/theme/tokens';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { TextField } from '@/components/ui/text-field';
import type { ReportPeriod } from '@/hooks/use-reports';

import { customPeriodSchema, DEFAULT_PRESET, lastDays, PRESETS, type PresetValue } from './period';

type CustomValues = z.infer<typeof customPeriodSchema>;

interface PeriodPickerProps {
  period: ReportPeriod;
  onChange: (period: ReportPeriod) => void;
}

/** A preset period, or two typed dates applied as soon as both are valid (no extra button). */
export function PeriodPicker({ period, onChange }: PeriodPickerProps) {
  const [preset, setPreset] = useState<PresetValue>(DEFAULT_PRESET);
  const {
    control,
    trigger,
    getValues,
    formState: { errors },
  } = useForm<CustomValues>({ resolver: zodResolver(customPeriodSchema), defaultValues: period, mode: 'onChange' });

  const applyIfValid = async () => {
    if (await trigger()) onChange(getValues());
  };

  return (
    <View style={styles.column}>
      <SegmentedControl
        label="Period"
        value={preset}
        onChange={(next) => {
          setPreset(next);
          if (next !== 'custom') onChange(lastDays(Number(next)));
          else void applyIfValid();
        }}
        options={PRESETS.map((p) => ({ ...p, testID: `reports-period-${p.value}` }))}
      />
      {preset === 'custom' ? (
        <View style={styles.dates}>
          {(['from', 'to'] as const).map((name) => (
            <View key={name} style={styles.date}>
              <Controller
                control={control}
                name={name}
                render={({ field: { ref, value, onChange: change, onBlur } }) => (
                  <TextField
                    ref={ref}
                    label={name === 'from' ? 'From (first day)' : 'To (last day)'}
                    hint="YYYY-MM-DD"
                    testID={`reports-period-${name}`}
                    value={value}
                    onChangeText={(text) => {
                      change(text);
                      void applyIfValid();
                    }}
                    onBlur={onBlur}
                    error={errors[name]?.message}
                    inputMode="numeric"
                    autoCorrect={false}
                    autoCapitalize="none"
                  />
                )}
              />
            </View>
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.sm },
  dates: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  date: { flexGrow: 1, flexBasis: 0, minWidth: 0 },
});
