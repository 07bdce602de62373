import { ERROR_CODES } from '@/shared/errors';
import { zodResolver } from '@hookform/resolvers/zod';
import { Controller, useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { showServerErrors } from '@/components/accounts/server-field-errors';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormAlert } from '@/components/ui/form-alert';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { EMAIL_INPUT, FormTextField } from '@/components/ui/form-fields';
import { isApiError } from '@/hooks/api-client';
import { useGroupsQuery, useInvitePersonMutation } from '@/hooks/use-people';
import { invitationSchema, type InvitationInput } from '@/shared/schemas/accounts';

import { groupIdFromOption, groupOptions, NO_GROUP, ROLE_HINTS, roleOptions } from './role-options';

const FIELDS = ['email', 'name', 'role', 'groupId'] as const;

interface InviteFormProps {
  onSent: (person: { name: string; email: string }) => void;
  onCancel: () => void;
}

/** Adds a person and e-mails them a one-time link to set their password. */
export function InviteForm({ onSent, onCancel }: InviteFormProps) {
  const invite = useInvitePersonMutation();
  const groups = useGroupsQuery();
  const {
    control,
    handleSubmit,
    setError,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<InvitationInput>({ resolver: zodResolver(invitationSchema), defaultValues: { name: '', email: '', role: 'member', groupId: null } });

  const submit = handleSubmit(async (values) => {
    try {
      const { person } = await invite.mutateAsync(values);
      onSent(person);
    } catch (error) {
      // A taken e-mail is a 409 without field errors, but it is plainly about the e-mail field.
      if (isApiError(error) && error.code === ERROR_CODES.emailTaken) {
        setError('email', { type: 'server', message: error.message }, { shouldFocus: true });
        return;
      }
      showServerErrors<InvitationInput>(error, FIELDS, setError);
    }
  });

  const role = watch('role');

  return (
    <Card title="Invite a person" testID="people-invite-form">
      <AppText tone="muted">They get an e-mail with a link to set their password. The link works once.</AppText>
      <View style={styles.fields}>
        <FormTextField control={control} name="name" label="Name" testID="invite-name" autoComplete="off" returnKeyType="next" />
        <FormTextField control={control} name="email" label="E-mail" testID="invite-email" {...EMAIL_INPUT} autoComplete="off" />
        <Controller
          control={control}
          name="role"
          render={({ field: { value, onChange } }) => (
            <View style={styles.group}>
              <SegmentedControl label="Role" value={value} onChange={onChange} options={roleOptions('invite-role')} />
              <AppText variant="small" tone={errors.role ? 'error' : 'muted'}>
                {errors.role?.message ?? ROLE_HINTS[role]}
              </AppText>
            </View>
          )}
        />
        {groups.data && groups.data.length > 0 ? (
          <Controller
            control={control}
            name="groupId"
            render={({ field: { value, onChange } }) => (
              <SegmentedControl
                label="Research group"
                value={value ? String(value) : NO_GROUP}
                onChange={(option) => onChange(groupIdFromOption(option))}
                options={groupOptions(groups.data, 'invite-group')}
              />
            )}
          />
        ) : groups.isError ? (
          <AppText variant="small" tone="muted">
            The groups did not load; invite without one and set it later.
          </AppText>
        ) : null}
      </View>
      {errors.root?.server?.message ? <FormAlert testID="people-invite-error" message={errors.root.server.message} /> : null}
      <View style={styles.actions}>
        <Button
          label="Send invitation"
          loadingLabel="Sending the invitation"
          icon="email-fast"
          testID="people-invite-submit"
          block
          loading={isSubmitting}
          onPress={() => void submit()}
        />
        <Button label="Cancel" variant="secondary" testID="people-invite-cancel" block onPress={onCancel} disabled={isSubmitting} />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  fields: { gap: spacing.md },
  group: { gap: spacing.xs },
  actions: { gap: spacing.sm },
});
