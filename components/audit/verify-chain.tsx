import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { describeError } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { useAuditVerificationQuery } from '@/hooks/use-audit';

/** Walks the hash chain on the server and says whether every entry is as it was written. */
export function VerifyChain() {
  const verify = useAuditVerificationQuery();
  return (
    <View style={styles.root}>
      <Button
        label="Verify chain"
        icon="database-check"
        variant="secondary"
        testID="audit-verify"
        loading={verify.isFetching}
        loadingLabel="Checking every entry"
        onPress={() => void verify.refetch()}
      />
      {verify.isError ? <FormAlert message={describeError(verify.error)} testID="audit-verify-error" /> : null}
      {verify.data && !verify.isFetching ? (
        verify.data.ok ? (
          <View style={styles.result} testID="audit-verify-ok">
            <Badge label={`Chain intact: ${verify.data.checked} entries checked`} icon="check-circle" tone="primary" />
            <AppText variant="small" tone="muted">
              Source: each entry&apos;s SHA-256 hash over the one before it, recomputed on the server from the stored values.
            </AppText>
          </View>
        ) : (
          <View style={styles.result} testID="audit-verify-broken">
            <HazardBadge level="danger" detail={`Chain broken at entry #${verify.data.brokenAtId ?? '?'}`} />
            <AppText>{`${verify.data.checked} entries matched before the break. Something changed the trail outside Voltcrib: tell the lab manager and keep the database as it is.`}</AppText>
          </View>
        )
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.sm },
  result: { gap: spacing.xxs },
});
