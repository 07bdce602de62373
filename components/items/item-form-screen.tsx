// Loaded on demand (lazy-item-form-screen.tsx): only managers ever open it, so the form code
// stays out of everyone's first download. Default export for React.lazy.
import { AppText } from '@/components/ui/app-text';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { useItemQuery } from '@/hooks/use-items';
import { useCurrentUser } from '@/hooks/use-session';

import { BackToGear } from './back-to-gear';
import { ItemForm } from './item-form';

export interface ItemFormScreenProps {
  /** Edit this item; register a new one when absent. */
  itemId?: number;
}

export default function ItemFormScreen({ itemId }: ItemFormScreenProps) {
  const isManager = useCurrentUser()?.role === 'manager';
  const editing = itemId !== undefined;
  const item = useItemQuery(itemId ?? 0);
  const title = editing ? (item.data ? `Edit ${item.data.tag}` : 'Edit gear') : 'Register gear';

  return (
    <Screen testID="item-form-screen" title={title} hideTitle width="form">
      <BackToGear />
      <AppText variant="title" headingLevel={1}>
        {title}
      </AppText>
      {!isManager ? (
        <EmptyState
          testID="item-form-not-allowed"
          icon="account-off"
          title="For the lab manager"
          message="Only the lab manager registers and edits gear. Ask them to change this item."
        />
      ) : !editing ? (
        <ItemForm />
      ) : item.isPending ? (
        <LoadingState label="Loading the item" />
      ) : item.isError ? (
        <ErrorState title="The item did not load" error={item.error} onRetry={() => void item.refetch()} retrying={item.isRefetching} />
      ) : item.data.status === 'retired' ? (
        <EmptyState icon="archive" title="Retired" message={`${item.data.tag} is retired; retired gear is kept as it was and cannot be changed.`} />
      ) : (
        <ItemForm item={item.data} />
      )}
    </Screen>
  );
}
