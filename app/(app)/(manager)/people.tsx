import { useLocalSearchParams } from 'expo-router';

import { LazyPeopleScreen } from '@/components/people/lazy-people-screen';

export default function PeopleRoute() {
  const { person } = useLocalSearchParams<{ person?: string }>();
  return <LazyPeopleScreen personId={person} />;
}
