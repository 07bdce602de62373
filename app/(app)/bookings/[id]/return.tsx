import { useLocalSearchParams } from 'expo-router';

import { ReturnScreen } from '@/components/returns/return-screen';

export default function ReturnRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <ReturnScreen id={Number(id)} />;
}
