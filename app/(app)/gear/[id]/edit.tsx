import { useLocalSearchParams } from 'expo-router';

import { LazyItemFormScreen } from '@/components/items/lazy-item-form-screen';

export default function EditItemRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <LazyItemFormScreen itemId={Number(id)} />;
}
