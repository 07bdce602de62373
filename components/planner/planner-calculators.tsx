// The Planner's body, loaded on demand (see planner-screen.tsx): every calculator runs here on the
// client with the same shared/hv functions the server's /api/calc uses, as the member types.
import { useEffect, useMemo, useRef, useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { useBreakpoints } from '@/hooks/use-breakpoints';
import { SAFETY_CAUTION } from '@/shared/rules/assessment';

import { CALCULATORS, initialState, type CalcState, type CalculatorName } from './calculators';
import { CautionNote } from './caution-note';
import { copyText } from './copy-text';
import { notebookText } from './notebook-text';
import { QuantityField } from './quantity-field';
import { ResultSectionView } from './result-section-view';

const COPIED_MS = 2500;

interface PlannerCalculatorsProps {
  tab: CalculatorName;
  onTabChange: (tab: CalculatorName) => void;
}

export default function PlannerCalculators({ tab, onTabChange }: PlannerCalculatorsProps) {
  const { isWide } = useBreakpoints();
  // Each calculator keeps what was typed while the member looks at another one.
  const [states, setStates] = useState<Record<string, CalcState>>(() => Object.fromEntries(CALCULATORS.map((c) => [c.name, initialState(c)])));
  const calc = CALCULATORS.find((c) => c.name === tab) ?? CALCULATORS[0]!;
  const state = states[calc.name] ?? initialState(calc);
  const view = useMemo(() => calc.compute(state), [calc, state]);

  const update = (next: CalcState) => setStates((all) => ({ ...all, [calc.name]: next }));

  const inputs = (
    <Card title={calc.title} testID={`planner-inputs-${calc.name}`}>
      <AppText tone="muted">{calc.intro}</AppText>
      {calc.choices.map((choice) => (
        <SegmentedControl
          key={choice.key}
          label={choice.label}
          value={state.choices[choice.key] ?? choice.defaultValue}
          onChange={(value) => update({ ...state, choices: { ...state.choices, [choice.key]: value } })}
          options={choice.options.map((o) => ({ ...o, testID: `planner-choice-${choice.key}-${o.value}` }))}
        />
      ))}
      {calc.fields.map((field) => (
        <QuantityField
          key={field.key}
          spec={field}
          input={state.fields[field.key] ?? { text: field.defaultText ?? '', unit: field.defaultUnit }}
          error={view.errors[field.key]}
          onChange={(input) => update({ ...state, fields: { ...state.fields, [field.key]: input } })}
        />
      ))}
    </Card>
  );

  const results = (
    <View style={styles.column}>
      {view.sections.map((section) => (
        <ResultSectionView key={section.key} section={section} />
      ))}
      <CopyButton text={() => notebookText(calc, state, view, SAFETY_CAUTION, new Date())} />
    </View>
  );

  return (
    <View style={styles.column}>
      <CautionNote />
      <SegmentedControl
        label="Calculation"
        hideLabel
        kind="tab"
        value={calc.name}
        onChange={onTabChange}
        options={CALCULATORS.map((c) => ({ value: c.name, label: c.label, testID: `planner-tab-${c.name}` }))}
      />
      {isWide ? (
        <View style={styles.columns}>
          <View style={styles.half}>{inputs}</View>
          <View style={styles.half}>{results}</View>
        </View>
      ) : (
        <>
          {inputs}
          {results}
        </>
      )}
    </View>
  );
}

function CopyButton({ text }: { text: () => string }) {
  const [state, setState] = useState<'idle' | 'copied' | 'failed'>('idle');
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  useEffect(
    () => () => {
      if (timer.current) clearTimeout(timer.current);
    },
    [],
  );

  const onPress = async () => {
    const ok = await copyText(text());
    setState(ok ? 'copied' : 'failed');
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => setState('idle'), COPIED_MS);
  };

  return (
    <View style={styles.copy}>
      <Button label={state === 'copied' ? 'Copied' : 'Copy as text'} testID="planner-copy" block onPress={() => void onPress()} />
      <AppText variant="small" tone={state === 'failed' ? 'error' : 'muted'} accessibilityLiveRegion="polite" testID="planner-copy-status">
        {state === 'copied'
          ? 'Copied: inputs, results, formulas and sources, ready to paste into a lab notebook.'
          : state === 'failed'
            ? 'This browser did not allow copying. Select the results and copy them by hand.'
            : 'Copies the inputs, results, formulas and sources as plain text for a lab notebook.'}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.lg },
  columns: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.lg },
  half: { flex: 1, minWidth: 0 },
  copy: { gap: spacing.xs },
});
