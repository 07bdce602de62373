import { router } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { useItemClearanceQuery } from '@/hooks/use-items';
import type { Item } from '@/shared/schemas/items';
import type { Role } from '@/shared/schemas/session';

import { InspectionForm } from './inspection-form';
import { ClearPanel, RetirePanel, TagOutPanel } from './item-status-panels';

type Panel = 'inspect' | 'tag-out' | 'clear' | 'retire';

interface ItemActionsProps {
  item: Item;
  role: Role;
}

/**
 * What this person may do to the item, by role (the server enforces the same): officers and
 * managers record inspections; managers also edit, tag out, clear and retire. Opening one of
 * these replaces the buttons with its panel, so one decision is on screen at a time.
 */
export function ItemActions({ item, role }: ItemActionsProps) {
  const [panel, setPanel] = useState<Panel | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const isManager = role === 'manager';
  const isStaff = isManager || role === 'officer';
  const clearance = useItemClearanceQuery(item.id, isManager && item.status === 'out-of-service');
  if (!isStaff || item.status === 'retired') return null;

  const finish = (message: string) => {
    setPanel(null);
    setDone(message);
  };
  const open = (next: Panel) => {
    setDone(null);
    setPanel(next);
  };
  const cancel = () => setPanel(null);

  if (panel === 'inspect') return <InspectionForm item={item} onDone={finish} onCancel={cancel} />;
  if (panel === 'tag-out') return <TagOutPanel item={item} onDone={finish} onCancel={cancel} />;
  if (panel === 'clear') return <ClearPanel item={item} onDone={finish} onCancel={cancel} />;
  if (panel === 'retire') return <RetirePanel item={item} onDone={finish} onCancel={cancel} />;

  return (
    <View style={styles.root} testID="item-actions">
      {done ? (
        <AppText variant="bodyStrong" accessibilityLiveRegion="polite" testID="item-action-done">
          {done}
        </AppText>
      ) : null}
      <View style={styles.row}>
        <Button label="Record inspection" icon="wrench" onPress={() => open('inspect')} testID="item-record-inspection" />
        {isManager ? (
          <>
            <Button
              label="Edit"
              icon="pencil"
              variant="secondary"
              onPress={() => router.push({ pathname: '/gear/[id]/edit', params: { id: String(item.id) } })}
              testID="item-edit"
            />
            {item.status === 'out-of-service' ? (
              // The server clears a tag only after a passing inspection since the tag-out; until
              // one is recorded, offer the inspection instead of a button it would refuse.
              clearance.data?.clearable ? (
                <Button label="Put back in service" icon="check-circle" variant="secondary" onPress={() => open('clear')} testID="item-clear" />
              ) : (
                <AppText variant="small" tone="muted" testID="item-clear-needs-inspection">
                  {clearance.data?.reason ?? 'Checking whether it can be put back in service…'}
                </AppText>
              )
            ) : (
              <Button label="Tag out" icon="tag-off" variant="secondary" onPress={() => open('tag-out')} testID="item-tag-out" />
            )}
            <Button label="Retire" icon="archive" variant="secondary" onPress={() => open('retire')} testID="item-retire" />
          </>
        ) : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
});
