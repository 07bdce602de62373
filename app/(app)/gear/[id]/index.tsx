import { useLocalSearchParams } from 'expo-router';

import { LazyItemScreen } from '@/components/items/lazy-item-screen';

export default function ItemRoute() {
  const { id, registered } = useLocalSearchParams<{ id: string; registered?: string }>();
  return <LazyItemScreen id={Number(id)} justRegistered={registered === '1'} />;
}
