import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { localTodayIso } from '@/components/items/format-dates';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { describeError } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/hooks/api-client';
import { useReviewIncidentMutation, type Incident } from '@/hooks/use-incidents';
import { useQualificationsQuery } from '@/hooks/use-qualification';
import { incidentUpdateSchema, type IncidentStatus } from '@/shared/schemas/incidents';

const STATUS_CHOICES = [
  { value: 'open', label: 'Open' },
  { value: 'under-review', label: 'Under review' },
  { value: 'closed', label: 'Closed' },
] as const;

/** The default due date of a new action: two weeks on (common practice, no source). */
function twoWeeksFrom(day: string): string {
  const d = new Date(`${day}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + 14);
  return d.toISOString().slice(0, 10);
}

interface ActionDraft {
  action: string;
  ownerId: number | null;
  dueOn: string;
}

/**
 * The safety officer's review: the status, the cause, and the corrective actions (what, who, by
 * when). Closing needs a cause and at least one action; the server says so too (400).
 */
export function ReviewForm({ incident }: { incident: Incident }) {
  const review = useReviewIncidentMutation(incident.id);
  const people = useQualificationsQuery();
  const [status, setStatus] = useState<IncidentStatus>(incident.status === 'open' ? 'under-review' : incident.status);
  const [cause, setCause] = useState(incident.cause ?? '');
  const [actions, setActions] = useState<ActionDraft[]>(() =>
    incident.correctiveActions.length > 0 ? incident.correctiveActions.map((a) => ({ action: a.action, ownerId: a.ownerId, dueOn: a.dueOn })) : [],
  );
  const [problem, setProblem] = useState<Record<string, string>>({});
  const [saved, setSaved] = useState<string | null>(null);
  const owners = (people.data ?? []).map((p) => ({ value: String(p.id), label: p.name }));

  const save = async () => {
    setSaved(null);
    const body = {
      status,
      cause: cause.trim(),
      correctiveActions: actions.map((a) => ({ action: a.action.trim(), ownerId: a.ownerId ?? 0, dueOn: a.dueOn.trim() })),
    };
    const local: Record<string, string> = {};
    const parsed = incidentUpdateSchema.safeParse(body);
    if (!parsed.success) for (const issue of parsed.error.issues) local[issue.path.join('.')] ??= issue.message;
    if (status === 'closed' && body.cause === '') local.cause = 'Say what caused it before closing';
    if (status === 'closed' && actions.length === 0) local.correctiveActions = 'Add at least one corrective action (what, who, by when) before closing';
    actions.forEach((a, i) => {
      if (a.ownerId === null) local[`correctiveActions.${i}.ownerId`] = 'Choose who will do it';
    });
    setProblem(local);
    if (Object.keys(local).length > 0) return;
    try {
      await review.mutateAsync(parsed.data!);
      setSaved(status === 'closed' ? 'Closed.' : 'Saved.');
    } catch (error) {
      const fields = isApiError(error) ? error.fieldErrors : undefined;
      const mapped: Record<string, string> = {};
      for (const [key, messages] of Object.entries(fields ?? {})) mapped[key] = messages.join(' ');
      setProblem(Object.keys(mapped).length > 0 ? mapped : { _: describeError(error) });
    }
  };

  const change = (index: number, patch: Partial<ActionDraft>) => setActions((list) => list.map((a, i) => (i === index ? { ...a, ...patch } : a)));

  return (
    <Card title="Your review" testID="incident-review-form">
      <ChoiceChips label="Status" testID="review-status" choices={STATUS_CHOICES} value={status} onChange={setStatus} />
      <TextField
        label="Cause"
        hint="What made it happen, as far as you have found."
        value={cause}
        onChangeText={setCause}
        multiline
        numberOfLines={3}
        error={problem.cause}
        testID="review-cause"
      />
      <AppText variant="label">Corrective actions</AppText>
      {problem.correctiveActions ? (
        <AppText tone="error" testID="review-actions-error">
          {problem.correctiveActions}
        </AppText>
      ) : null}
      {actions.map((a, index) => (
        <View key={index} style={styles.action}>
          <TextField
            label={`Action ${index + 1}: what will be done`}
            value={a.action}
            onChangeText={(text) => change(index, { action: text })}
            error={problem[`correctiveActions.${index}.action`]}
            testID={`review-action-${index}`}
          />
          {owners.length > 0 ? (
            <ChoiceChips
              label={`Action ${index + 1}: who`}
              testID={`review-action-owner-${index}`}
              choices={owners}
              value={a.ownerId === null ? undefined : String(a.ownerId)}
              onChange={(v) => change(index, { ownerId: Number(v) })}
              error={problem[`correctiveActions.${index}.ownerId`]}
            />
          ) : (
            <AppText tone="muted">{people.isPending ? 'Loading the people…' : 'The list of people did not load.'}</AppText>
          )}
          <TextField
            label={`Action ${index + 1}: due by`}
            hint="A date, written YYYY-MM-DD"
            value={a.dueOn}
            onChangeText={(text) => change(index, { dueOn: text })}
            error={problem[`correctiveActions.${index}.dueOn`]}
            testID={`review-action-due-${index}`}
          />
          <Button
            label={`Remove action ${index + 1}`}
            variant="secondary"
            icon="close"
            onPress={() => setActions((list) => list.filter((_, i) => i !== index))}
          />
        </View>
      ))}
      <Button
        label="Add a corrective action"
        icon="plus"
        variant="secondary"
        onPress={() => setActions((list) => [...list, { action: '', ownerId: null, dueOn: twoWeeksFrom(localTodayIso()) }])}
        testID="review-add-action"
      />
      {problem._ ? <FormAlert message={problem._} /> : null}
      {saved ? (
        <AppText variant="bodyStrong" accessibilityLiveRegion="polite" testID="review-saved">
          {saved}
        </AppText>
      ) : null}
      <Button
        label={status === 'closed' ? 'Close the incident' : 'Save the review'}
        icon="check-circle"
        block
        loading={review.isPending}
        loadingLabel="Saving"
        onPress={() => void save()}
        testID="review-save"
      />
    </Card>
  );
}

const styles = StyleSheet.create({
  action: { gap: spacing.sm },
});
