import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { describeError } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { useUpdatePersonMutation, type Person } from '@/hooks/use-people';

/** Deactivate or reactivate, each behind a confirmation that says what happens. */
export function PersonActivation({ person, isSelf }: { person: Person; isSelf: boolean }) {
  const update = useUpdatePersonMutation();
  const [confirming, setConfirming] = useState(false);
  const action = person.active ? 'deactivate' : 'reactivate';

  if (isSelf) {
    return (
      <Card title="Access">
        <AppText tone="muted">You cannot deactivate yourself; another manager can.</AppText>
      </Card>
    );
  }

  const apply = () =>
    update.mutate(
      { id: person.id, change: { active: !person.active } },
      {
        onSuccess: () => setConfirming(false),
      },
    );

  return (
    <Card title="Access" testID="person-access">
      {confirming ? (
        <View style={styles.confirm} testID={`person-${action}-question`} accessibilityRole="alert">
          <AppText variant="bodyStrong">{person.active ? `Deactivate ${person.name}?` : `Reactivate ${person.name}?`}</AppText>
          <AppText>
            {person.active
              ? 'Their sessions end at once: anyone signed in as them, on any device, is signed out now. They cannot sign in again until reactivated. Their bookings, checklists and history stay on record.'
              : 'They can sign in again with their existing password. Their role, group and qualification are as before.'}
          </AppText>
          {update.isError ? <FormAlert testID="person-access-error" message={describeError(update.error)} /> : null}
          <Button
            label={person.active ? 'Deactivate now' : 'Reactivate now'}
            loadingLabel={person.active ? 'Deactivating' : 'Reactivating'}
            variant={person.active ? 'danger' : 'primary'}
            icon={person.active ? 'account-off' : 'account-check'}
            block
            testID={`person-${action}-confirm`}
            loading={update.isPending}
            onPress={apply}
          />
          <Button
            label="Keep as is"
            variant="secondary"
            block
            testID={`person-${action}-cancel`}
            onPress={() => setConfirming(false)}
            disabled={update.isPending}
          />
        </View>
      ) : (
        <>
          <AppText tone="muted">{person.active ? 'Active: can sign in and book gear.' : 'Inactive: cannot sign in. Bookings and records are kept.'}</AppText>
          <Button
            label={person.active ? 'Deactivate' : 'Reactivate'}
            variant={person.active ? 'danger' : 'secondary'}
            icon={person.active ? 'account-off' : 'account-check'}
            block
            testID={`person-${action}`}
            onPress={() => {
              update.reset();
              setConfirming(true);
            }}
          />
        </>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  confirm: { gap: spacing.sm },
});
