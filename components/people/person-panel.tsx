import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { showServerErrors } from '@/components/accounts/server-field-errors';
import { formatDateTime } from '@/components/common/format';
import { roleLabels } from '@/components/common/roles';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormAlert } from '@/components/ui/form-alert';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { useGroupsQuery, useUpdatePersonMutation, type Group, type Person } from '@/hooks/use-people';
import { personUpdateSchema, type PersonUpdateInput } from '@/shared/schemas/accounts';
import type { Role } from '@/shared/schemas/session';

import { PersonActivation } from './person-activation';
import { formatCalendarDate, qualificationState } from './qualification';
import { groupIdFromOption, groupOptions, NO_GROUP, ROLE_HINTS, roleOptions } from './role-options';

interface PersonPanelProps {
  person: Person;
  /** The signed-in manager: nobody may change their own role or deactivate themselves. */
  isSelf: boolean;
  today: string;
}

/** One person: who they are, their HV qualification, and what a manager may change. */
export function PersonPanel({ person, isSelf, today }: PersonPanelProps) {
  return (
    <View style={styles.column} testID="person-panel">
      <Card>
        <AppText variant="heading" headingLevel={2}>
          {person.name}
        </AppText>
        <AppText tone="muted">{person.email}</AppText>
        <View style={styles.badges}>
          <Badge label={roleLabels[person.role]} tone={person.role === 'member' ? 'neutral' : 'primary'} icon="badge-account" />
          {person.active ? <Badge label="Active" icon="account-check" /> : <Badge label="Inactive" tone="muted" icon="account-off" />}
        </View>
        <AppText variant="small" tone="muted">
          {person.groupName ?? 'No group'} · Last sign-in: {person.lastSignInAt ? formatDateTime(person.lastSignInAt) : 'never'}
        </AppText>
      </Card>
      <QualificationCard person={person} today={today} />
      <ChangeCard key={person.id} person={person} isSelf={isSelf} />
      <PersonActivation person={person} isSelf={isSelf} />
    </View>
  );
}

function QualificationCard({ person, today }: { person: Person; today: string }) {
  const state = qualificationState(person.qualification, today);
  return (
    <Card title="HV qualification" testID="person-qualification">
      {state.kind === 'none' ? (
        <AppText tone="muted">None on record. The safety officer records qualifications; without one this person cannot release gear for a test.</AppText>
      ) : state.kind === 'expired' ? (
        <>
          <HazardBadge level="warning" detail={`Expired ${formatCalendarDate(state.expiresOn)}`} />
          <AppText>
            Was authorised up to {state.authorisedKv} kV. Until the safety officer renews it, this person cannot release gear for a test unless an approval
            covers them.
          </AppText>
        </>
      ) : (
        <>
          <AppText variant="bodyStrong">Authorised up to {state.authorisedKv} kV</AppText>
          <AppText tone="muted">Valid until {formatCalendarDate(state.expiresOn)}. Recorded by the safety officer.</AppText>
        </>
      )}
    </Card>
  );
}

interface ChangeValues {
  role: Role;
  group: string;
}

/**
 * The list gives the group's name, not its id (see the report for the API): the id is found by
 * name among the lab's groups.
 */
function groupOptionFor(person: Person, groups: readonly Group[] | undefined): string {
  const match = groups?.find((g) => g.name === person.groupName);
  return match ? String(match.id) : NO_GROUP;
}

function ChangeCard({ person, isSelf }: { person: Person; isSelf: boolean }) {
  const update = useUpdatePersonMutation();
  const groups = useGroupsQuery();
  const [saved, setSaved] = useState(false);
  const initial: ChangeValues = { role: person.role, group: groupOptionFor(person, groups.data) };
  // `values` re-syncs the form when the saved person comes back from the server (or the groups
  // load), without losing what is being edited in between.
  const {
    control,
    handleSubmit,
    setError,
    reset,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<ChangeValues>({ values: initial });
  const values = watch();
  const change: PersonUpdateInput = {
    ...(values.role !== initial.role ? { role: values.role } : {}),
    ...(values.group !== initial.group ? { groupId: groupIdFromOption(values.group) } : {}),
  };
  const changed = Object.keys(change).length > 0;

  const submit = handleSubmit(async () => {
    // The shared schema checks the change exactly as the server will (and refuses an empty one).
    const parsed = personUpdateSchema.safeParse(change);
    if (!parsed.success) {
      setError('root.server', { type: 'client', message: parsed.error.issues[0]?.message ?? 'Nothing to change' });
      return;
    }
    try {
      await update.mutateAsync({ id: person.id, change: parsed.data });
      setSaved(true);
      reset(values);
    } catch (error) {
      showServerErrors<ChangeValues>(error, [], setError);
    }
  });

  return (
    <Card title="Role and group" testID="person-change">
      <Controller
        control={control}
        name="role"
        render={({ field: { value, onChange } }) =>
          isSelf ? (
            <AppText tone="muted">You cannot change your own role; another manager can.</AppText>
          ) : (
            <View style={styles.group}>
              <SegmentedControl
                label="Role"
                value={value}
                onChange={(next) => {
                  setSaved(false);
                  onChange(next);
                }}
                options={roleOptions('person-role')}
              />
              <AppText variant="small" tone="muted">
                {ROLE_HINTS[value]}
              </AppText>
            </View>
          )
        }
      />
      {groups.data ? (
        <Controller
          control={control}
          name="group"
          render={({ field: { value, onChange } }) => (
            <SegmentedControl
              label="Research group"
              value={value}
              onChange={(next) => {
                setSaved(false);
                onChange(next);
              }}
              options={groupOptions(groups.data, 'person-group')}
            />
          )}
        />
      ) : groups.isError ? (
        <AppText variant="small" tone="muted">
          The lab&apos;s groups did not load, so the group cannot be changed right now.
        </AppText>
      ) : null}
      {values.role !== person.role ? (
        <AppText variant="small" testID="person-role-note">
          Saving a new role signs {person.name} out everywhere at once, so the new role applies from their next sign-in.
        </AppText>
      ) : null}
      {errors.root?.server?.message ? <FormAlert testID="person-error" message={errors.root.server.message} /> : null}
      {saved ? (
        <AppText variant="smallStrong" testID="person-saved" accessibilityLiveRegion="polite">
          Saved.
        </AppText>
      ) : null}
      <Button
        label="Save changes"
        loadingLabel="Saving"
        icon="account-check"
        testID="person-save"
        block
        disabled={!changed}
        loading={isSubmitting}
        onPress={() => void submit()}
      />
    </Card>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.lg },
  badges: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  group: { gap: spacing.xs },
});
