import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { describeQualification, localToday, qualificationState } from '@/components/people/qualification';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { ListRow } from '@/components/ui/list-row';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { useQualificationsQuery, type QualifiedPerson } from '@/hooks/use-qualification';

import { QualificationForm } from './qualification-form';

/** The safety officer records who may work up to which voltage, and until when. */
export function QualificationsScreen() {
  const people = useQualificationsQuery();
  const [editing, setEditing] = useState<QualifiedPerson | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const today = localToday();
  return (
    <Screen testID="qualifications-screen" title="Qualifications">
      <AppText tone="muted">Bookings above a person’s authorised voltage, or after it expires, need an officer’s approval before release.</AppText>
      {saved ? <Badge label={saved} icon="check-circle" tone="primary" testID="qualification-saved" /> : null}
      {people.isPending ? (
        <LoadingState label="Loading people" />
      ) : people.isError ? (
        <ErrorState title="People did not load" error={people.error} onRetry={() => void people.refetch()} retrying={people.isFetching} />
      ) : people.data.length === 0 ? (
        <EmptyState title="No one yet" message="The lab manager invites people from the People screen." />
      ) : (
        <Card>
          <View style={styles.list}>
            {people.data.map((person, index) => {
              const state = qualificationState(person.qualification, today);
              // The form opens right under the person pressed, where the eye and thumb already are
              // (at the top of the screen it opened out of sight on a phone).
              return editing?.id === person.id ? (
                <View key={person.id} style={styles.editing} testID={`qualification-editing-${person.id}`}>
                  <AppText variant="heading" headingLevel={2}>
                    {person.name}
                  </AppText>
                  <QualificationForm
                    person={editing}
                    onCancel={() => setEditing(null)}
                    onDone={(message) => {
                      setSaved(message);
                      setEditing(null);
                    }}
                  />
                </View>
              ) : (
                <ListRow
                  key={person.id}
                  title={person.name}
                  subtitle={`${describeQualification(state)}${person.groupName ? ` · ${person.groupName}` : ''}`}
                  icon="badge-account"
                  divided={index > 0}
                  onPress={() => {
                    setSaved(null);
                    setEditing(person);
                  }}
                  testID={`qualification-person-${person.id}`}
                  tone={state.kind === 'current' ? 'default' : 'danger'}
                />
              );
            })}
          </View>
        </Card>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.xs },
  editing: { gap: spacing.md, paddingVertical: spacing.sm },
});
