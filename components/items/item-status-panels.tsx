// Tag out, clear and retire: each a small panel in place of the action buttons, so the one thing
// being decided is the only thing on offer. All three are PATCH /api/items/:id status changes.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';

import { borders, shapes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { FormTextField } from '@/components/ui/form-fields';
import { useUpdateItemMutation } from '@/hooks/use-items';
import { itemUpdateSchema, type Item, type ItemUpdateInput } from '@/shared/schemas/items';

import { applyServerErrors } from './server-errors';

interface PanelProps {
  item: Item;
  onDone: (message: string) => void;
  onCancel: () => void;
}

type StatusChangeValues = z.input<typeof itemUpdateSchema>;

function StatusReasonPanel({ item, onDone, onCancel, status }: PanelProps & { status: 'out-of-service' | 'retired' }) {
  const { colors } = useTheme();
  const update = useUpdateItemMutation(item.id);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm<StatusChangeValues, unknown, ItemUpdateInput>({
    resolver: zodResolver(itemUpdateSchema),
    defaultValues: { status, statusReason: '' },
  });
  const tagOut = status === 'out-of-service';

  const submit = handleSubmit((values) => {
    setFormError(null);
    update.mutate(values, {
      onSuccess: () => onDone(tagOut ? `${item.tag} is tagged out of service.` : `${item.tag} is retired.`),
      onError: (error) =>
        setFormError(
          applyServerErrors(error, (path, message) => {
            if (path !== 'statusReason') return false;
            setError('statusReason', { type: 'server', message });
            return true;
          }),
        ),
    });
  });

  return (
    <View style={[styles.panel, { borderColor: colors.borderStrong, backgroundColor: colors.surface }]} testID={tagOut ? 'tag-out-panel' : 'retire-panel'}>
      <AppText variant="heading" headingLevel={2}>
        {tagOut ? `Tag ${item.tag} out of service` : `Retire ${item.tag}?`}
      </AppText>
      <AppText>
        {tagOut
          ? 'It can then not be booked or released, and anyone who scans it sees why. Put a physical tag on it too.'
          : 'Retired gear leaves the gear list, cannot be booked, and can never be changed again. Its record, inspections and history are kept.'}
      </AppText>
      <FormTextField
        control={control}
        name="statusReason"
        label={tagOut ? 'Why is it out of service?' : 'Why retire it? (optional)'}
        hint={tagOut ? 'What is wrong, as the next person needs to read it' : undefined}
        multiline
        testID={tagOut ? 'tag-out-reason' : 'retire-reason'}
      />
      {formError ? <FormAlert message={formError} /> : null}
      <View style={styles.buttons}>
        <Button
          label={tagOut ? 'Tag out' : `Retire ${item.tag}`}
          icon={tagOut ? 'tag-off' : 'archive'}
          variant="danger"
          onPress={() => void submit()}
          loading={update.isPending}
          loadingLabel={tagOut ? 'Tagging out' : 'Retiring'}
          testID={tagOut ? 'tag-out-submit' : 'retire-submit'}
        />
        <Button label="Cancel" variant="secondary" onPress={onCancel} disabled={update.isPending} />
      </View>
    </View>
  );
}

export function TagOutPanel(props: PanelProps) {
  return <StatusReasonPanel {...props} status="out-of-service" />;
}

export function RetirePanel(props: PanelProps) {
  return <StatusReasonPanel {...props} status="retired" />;
}

export function ClearPanel({ item, onDone, onCancel }: PanelProps) {
  const { colors } = useTheme();
  const update = useUpdateItemMutation(item.id);
  const inspectionCurrent = item.inspectionState === 'current' || item.inspectionState === 'due-soon';
  return (
    <View style={[styles.panel, { borderColor: colors.borderStrong, backgroundColor: colors.surface }]} testID="clear-panel">
      <AppText variant="heading" headingLevel={2}>
        {`Put ${item.tag} back in service?`}
      </AppText>
      {item.statusReason ? <AppText variant="bodyStrong">{`It was tagged out: ${item.statusReason}`}</AppText> : null}
      <AppText>Clear the tag only once the fault is repaired and the item has passed an inspection.</AppText>
      {!inspectionCurrent ? (
        <AppText tone="error" variant="bodyStrong">
          Its inspection is not current, so it still cannot be released for a test until one passes.
        </AppText>
      ) : null}
      {update.isError ? <FormAlert message={applyServerErrors(update.error, () => false) ?? 'The change was refused.'} testID="clear-error" /> : null}
      <View style={styles.buttons}>
        <Button
          label="Put back in service"
          icon="check-circle"
          onPress={() => update.mutate({ status: 'in-service' }, { onSuccess: () => onDone(`${item.tag} is back in service.`) })}
          loading={update.isPending}
          loadingLabel="Clearing the tag"
          testID="clear-submit"
        />
        <Button label="Cancel" variant="secondary" onPress={onCancel} disabled={update.isPending} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: spacing.md, padding: spacing.md, borderWidth: borders.control, borderRadius: shapes.cardRadius },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
});
