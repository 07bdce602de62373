import { AppText } from './app-text';
import { Button } from './button';

/** The parts of a useInfiniteQuery result that paging needs. */
interface PagedQuery {
  hasNextPage: boolean;
  isFetchingNextPage: boolean;
  isFetchNextPageError: boolean;
  fetchNextPage: () => Promise<unknown>;
}

interface LoadMoreProps {
  query: PagedQuery;
  label?: string;
  /** Said while the next page loads, e.g. "Loading more gear". */
  loadingLabel?: string;
  /** Said when the next page failed; the button stays to try again. */
  failedText?: string;
  /** Full width, for lists in a narrow column. */
  block?: boolean;
  testID: string;
}

/** The button under a paged list that loads its next page, and the message when that failed. */
export function LoadMore({
  query,
  label = 'Load more',
  loadingLabel = 'Loading more',
  failedText = 'The next page did not load. Try again.',
  block = false,
  testID,
}: LoadMoreProps) {
  return (
    <>
      {query.isFetchNextPageError ? (
        <AppText tone="error" accessibilityRole="alert" testID={`${testID}-error`}>
          {failedText}
        </AppText>
      ) : null}
      {query.hasNextPage ? (
        <Button
          label={label}
          icon="chevron-down"
          variant="secondary"
          block={block}
          onPress={() => void query.fetchNextPage()}
          loading={query.isFetchingNextPage}
          loadingLabel={loadingLabel}
          testID={testID}
        />
      ) : null}
    </>
  );
}
