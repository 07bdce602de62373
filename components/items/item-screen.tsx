import { router } from 'expo-router';
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { isApiError } from '@/hooks/api-client';
import { useBreakpoints } from '@/hooks/use-breakpoints';
import { useItemQuery } from '@/hooks/use-items';
import { useCurrentUser } from '@/hooks/use-session';
import { ERROR_CODES } from '@/shared/errors';
import type { Item } from '@/shared/schemas/items';
import type { Role } from '@/shared/schemas/session';

import { RelatedIncidentsCard, ReportProblemButton } from '@/components/incidents/related-incidents-card';

import { BackToGear } from './back-to-gear';
import { ItemActions } from './item-actions';
import { ItemBookingsCard } from './item-bookings-card';
import { ItemFilesCard, ItemPhoto } from './item-files-card';
import { ItemHistoryCard } from './item-history-card';
import { ItemInspectionsCard } from './item-inspections-card';
import { ItemLabelCard } from './item-label-card';
import { ItemRatingsCard } from './item-ratings-card';
import { ItemSummaryCard } from './item-summary-card';

export function ItemScreen({ id, justRegistered = false }: { id: number; justRegistered?: boolean }) {
  const item = useItemQuery(id);
  const role = useCurrentUser()?.role ?? 'member';
  const { isWide } = useBreakpoints();
  const validId = Number.isInteger(id) && id > 0;
  const missing = !validId || (isApiError(item.error) && item.error.code === ERROR_CODES.notFound);

  return (
    // The back link comes before the heading, so the Screen's own title is hidden and drawn here.
    <Screen testID="item-screen" title={item.data?.name ?? 'Gear item'} hideTitle width={isWide ? 'wide' : 'regular'}>
      <BackToGear />
      <AppText variant="title" headingLevel={1}>
        {item.data?.name ?? 'Gear item'}
      </AppText>
      {missing ? (
        <EmptyState
          testID="item-not-found"
          icon="map-marker-question"
          title="No such item"
          message="This item is not in the registry. It may have been entered with a wrong address."
        />
      ) : item.isPending ? (
        <LoadingState label="Loading the item" testID="item-loading" />
      ) : item.isError ? (
        <ErrorState testID="item-error" title="The item did not load" error={item.error} onRetry={() => void item.refetch()} retrying={item.isRefetching} />
      ) : (
        <>
          {justRegistered ? (
            <View accessibilityLiveRegion="polite" testID="item-registered">
              <AppText variant="bodyStrong">
                {`Registered ${item.data.tag}. Print its label below and stick it on the item. ${item.data.inspectionState === 'never' ? 'Record its first inspection: until then the release refuses it.' : ''}`}
              </AppText>
            </View>
          ) : null}
          <ItemBody item={item.data} role={role} isWide={isWide} />
        </>
      )}
    </Screen>
  );
}

function ItemBody({ item, role, isWide }: { item: Item; role: Role; isWide: boolean }) {
  const isManager = role === 'manager';
  const isStaff = isManager || role === 'officer';
  const first = (
    <>
      <ItemSummaryCard item={item} />
      {item.status === 'in-service' ? (
        <View style={styles.book}>
          <Button
            label="Book this"
            icon="calendar-plus"
            testID="item-book-this"
            onPress={() => router.push({ pathname: '/bookings/new', params: { itemId: String(item.id) } })}
          />
        </View>
      ) : null}
      <ItemActions item={item} role={role} />
      <ReportProblemButton itemId={item.id} />
      <ItemPhoto item={item} />
      <ItemRatingsCard item={item} />
      <ItemLabelCard item={item} canPrint={isStaff} />
    </>
  );
  const second = (
    <>
      <ItemInspectionsCard item={item} />
      <ItemFilesCard item={item} canUpload={isManager} />
      <ItemBookingsCard itemId={item.id} canOpen={isStaff} />
      <RelatedIncidentsCard itemId={item.id} withButton={false} />
      <ItemHistoryCard itemId={item.id} />
    </>
  );
  if (!isWide) {
    return (
      <Column>
        {first}
        {second}
      </Column>
    );
  }
  return (
    <View style={styles.columns}>
      <Column>{first}</Column>
      <Column>{second}</Column>
    </View>
  );
}

function Column({ children }: { children: ReactNode }) {
  return <View style={styles.column}>{children}</View>;
}

const styles = StyleSheet.create({
  columns: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.lg },
  column: { flex: 1, gap: spacing.lg, minWidth: 0 },
  book: { alignItems: 'flex-start' },
});
