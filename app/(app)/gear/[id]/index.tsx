import { useLocalSearchParams } from 'expo-router';

import { LazyItemScreen } from '@/components/items/lazy-item-screen';

export default function ItemRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <LazyItemScreen id={Number(id)} />;
}
