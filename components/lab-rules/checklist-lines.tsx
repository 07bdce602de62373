import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { trimNumber } from '@/components/assessment/quantities';
import { borders, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Button } from '@/components/ui/button';
import { useChecklistTemplatesQuery, useRetireChecklistTemplateMutation, type ChecklistTemplate } from '@/hooks/use-checklist-templates';

import { ChecklistLineForm } from './checklist-line-form';
import { KIND_LABELS, type ItemKind } from '@/shared/schemas/items';

function conditions(line: ChecklistTemplate): string {
  const parts: string[] = [];
  if (line.appliesFromKv !== null) parts.push(`from ${trimNumber(line.appliesFromKv)} kV`);
  if (line.appliesWithKind !== null) parts.push(`with a ${KIND_LABELS[line.appliesWithKind as ItemKind] ?? line.appliesWithKind}`);
  const limits =
    line.kind === 'reading'
      ? ` · ${line.min ?? '—'} to ${line.maxFromRule === 'safeResidualV' ? "the lab's safe residual voltage" : (line.max ?? '—')} ${line.unit ?? ''}`
      : '';
  return `${line.kind === 'confirm' ? 'Confirm' : line.kind === 'reading' ? 'Reading' : 'Photo'}${line.required ? '' : ', optional'} · ${parts.length > 0 ? `applies ${parts.join(' and ')}` : 'always applies'}${limits}`;
}

/** The checklists the release and the return ask for, as the lab keeps them now. */
export function ChecklistLines() {
  const { colors } = useTheme();
  const templates = useChecklistTemplatesQuery();
  const retire = useRetireChecklistTemplateMutation();
  // Retiring a line changes every release from now on: the press asks once more, naming the line.
  const [confirming, setConfirming] = useState<number | null>(null);
  return (
    <Card title="Checklist lines" testID="checklist-lines">
      {templates.isPending ? (
        <LoadingState label="Loading the checklists" />
      ) : templates.isError ? (
        <ErrorState title="The checklists did not load" error={templates.error} onRetry={() => void templates.refetch()} retrying={templates.isFetching} />
      ) : templates.data.length === 0 ? (
        <AppText tone="muted">No checklist lines. Releases then ask for no pre-energize checks: add lines before the next test.</AppText>
      ) : (
        (['pre', 'return'] as const).map((phase) => (
          <View key={phase} style={styles.phase}>
            <AppText variant="bodyStrong">{phase === 'pre' ? 'Pre-energize (at release)' : 'Make-safe (at return)'}</AppText>
            {templates.data
              .filter((line) => line.phase === phase)
              .map((line, index) => (
                <View key={line.id} style={[styles.line, index > 0 && { borderTopWidth: borders.hairline, borderTopColor: colors.border }]}>
                  <AppText>{line.text}</AppText>
                  <AppText variant="small" tone="muted">
                    {conditions(line)}
                  </AppText>
                  <Button
                    label="Retire this line"
                    variant="secondary"
                    icon="close"
                    onPress={() => setConfirming(line.id)}
                    testID={`checklist-line-retire-${line.id}`}
                  />
                  {confirming === line.id ? (
                    <View style={styles.confirm} testID={`checklist-line-retire-${line.id}-confirm`}>
                      <AppText variant="bodyStrong">{`Retire “${line.text}”? Checklists answered from now on no longer ask it.`}</AppText>
                      <View style={styles.row}>
                        <Button
                          label="Yes, retire it"
                          variant="danger"
                          icon="close"
                          loading={retire.isPending && retire.variables === line.id}
                          loadingLabel="Retiring"
                          testID={`checklist-line-retire-${line.id}-yes`}
                          onPress={() => retire.mutate(line.id, { onSuccess: () => setConfirming(null) })}
                        />
                        <Button label="Keep it" variant="secondary" testID={`checklist-line-retire-${line.id}-no`} onPress={() => setConfirming(null)} />
                      </View>
                    </View>
                  ) : null}
                </View>
              ))}
          </View>
        ))
      )}
      <AppText variant="bodyStrong">Add a line</AppText>
      <ChecklistLineForm />
    </Card>
  );
}

const styles = StyleSheet.create({
  phase: { gap: spacing.xs },
  line: { gap: spacing.xxs, paddingVertical: spacing.xs },
  confirm: { gap: spacing.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
