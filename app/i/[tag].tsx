import { useLocalSearchParams } from 'expo-router';

import { ItemByTagScreen } from '@/components/items/item-by-tag-screen';

export default function ItemByTagRoute() {
  const { tag } = useLocalSearchParams<{ tag: string }>();
  return <ItemByTagScreen tag={tag} />;
}
