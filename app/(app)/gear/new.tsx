import { LazyItemFormScreen } from '@/components/items/lazy-item-form-screen';

export default function NewItemRoute() {
  return <LazyItemFormScreen />;
}
