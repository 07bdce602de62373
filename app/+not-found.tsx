import { NotFoundScreen } from '@/components/common/not-found-screen';

export default function NotFoundRoute() {
  return <NotFoundScreen />;
}
