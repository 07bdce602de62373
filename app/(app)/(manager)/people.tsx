import { PeopleScreen } from '@/components/people/people-screen';

export default function PeopleRoute() {
  return <PeopleScreen />;
}
